import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { auditFilterForm } from '@shared/schemas/audit';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { AUDIT_FILTER_FIELDS, type AuditFilter, useAuditVocabulary } from '../api/audit';

/** Filter controls; applied on submit so typing does not fire a request per key. */
export function AuditFilters({ value, onApply }: { value: AuditFilter; onApply: (filter: AuditFilter) => void }) {
  const { register, handleSubmit, reset, formState } = useForm({ resolver: zodResolver(auditFilterForm), defaultValues: value });
  const vocabulary = useAuditVocabulary();
  const submit = handleSubmit((draft) => {
    const clean: AuditFilter = {};
    for (const f of AUDIT_FILTER_FIELDS) if (draft[f]?.trim()) clean[f] = draft[f]!.trim();
    onApply(clean);
  });
  const clear = () => {
    reset({ action: '', actor: '', targetType: '', targetId: '', from: '', to: '' });
    onApply({});
  };
  const errorOf = (key: keyof AuditFilter) => formState.errors[key]?.message;
  return (
    <form onSubmit={submit} aria-label="Audit filters" className="grid grid-cols-2 gap-3 md:grid-cols-3 xl:grid-cols-6">
      <Field label="Action" htmlFor="audit-action" error={errorOf('action')}>
        <Select id="audit-action" {...register('action')}>
          <option value="">Any action</option>
          {vocabulary.data?.actions.map((a) => (
            <option key={a} value={a}>
              {a}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="Actor e-mail contains" htmlFor="audit-actor" error={errorOf('actor')}>
        <Input id="audit-actor" {...register('actor')} placeholder="modeller@" />
      </Field>
      <Field label="Target type" htmlFor="audit-target-type" error={errorOf('targetType')}>
        <Select id="audit-target-type" {...register('targetType')}>
          <option value="">Any target</option>
          {vocabulary.data?.targetTypes.map((t) => (
            <option key={t} value={t}>
              {t}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="Target id" htmlFor="audit-target-id" error={errorOf('targetId')}>
        <Input id="audit-target-id" {...register('targetId')} />
      </Field>
      <Field label="From (UTC day)" htmlFor="audit-from" error={errorOf('from')}>
        <Input id="audit-from" type="date" {...register('from')} />
      </Field>
      <Field label="To (UTC day, inclusive)" htmlFor="audit-to" error={errorOf('to')}>
        <Input id="audit-to" type="date" {...register('to')} />
      </Field>
      <div className="col-span-full flex gap-2">
        <Button type="submit" variant="primary">
          Apply filters
        </Button>
        <Button onClick={clear} variant="quiet">
          Clear
        </Button>
      </div>
    </form>
  );
}
