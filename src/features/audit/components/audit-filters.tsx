import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { AUDIT_FILTER_FIELDS, type AuditFilter, useAuditVocabulary } from '../api/audit';

/** Filter controls; applied on submit so typing does not fire a request per key. */
export function AuditFilters({ value, onApply }: { value: AuditFilter; onApply: (filter: AuditFilter) => void }) {
  const [draft, setDraft] = useState<AuditFilter>(value);
  const vocabulary = useAuditVocabulary();
  const set = (key: keyof AuditFilter) => (e: { target: { value: string } }) => setDraft((d) => ({ ...d, [key]: e.target.value }));
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const clean: AuditFilter = {};
    for (const f of AUDIT_FILTER_FIELDS) if (draft[f]?.trim()) clean[f] = draft[f]!.trim();
    onApply(clean);
  };
  const clear = () => {
    setDraft({});
    onApply({});
  };
  return (
    <form onSubmit={submit} aria-label="Audit filters" className="grid grid-cols-2 gap-3 md:grid-cols-3 xl:grid-cols-6">
      <Field label="Action" htmlFor="audit-action">
        <Select id="audit-action" value={draft.action ?? ''} onChange={set('action')}>
          <option value="">Any action</option>
          {vocabulary.data?.actions.map((a) => (
            <option key={a} value={a}>{a}</option>
          ))}
        </Select>
      </Field>
      <Field label="Actor e-mail contains" htmlFor="audit-actor">
        <Input id="audit-actor" value={draft.actor ?? ''} onChange={set('actor')} placeholder="modeller@" />
      </Field>
      <Field label="Target type" htmlFor="audit-target-type">
        <Select id="audit-target-type" value={draft.targetType ?? ''} onChange={set('targetType')}>
          <option value="">Any target</option>
          {vocabulary.data?.targetTypes.map((t) => (
            <option key={t} value={t}>{t}</option>
          ))}
        </Select>
      </Field>
      <Field label="Target id" htmlFor="audit-target-id">
        <Input id="audit-target-id" value={draft.targetId ?? ''} onChange={set('targetId')} />
      </Field>
      <Field label="From (UTC day)" htmlFor="audit-from">
        <Input id="audit-from" type="date" value={draft.from ?? ''} onChange={set('from')} />
      </Field>
      <Field label="To (UTC day, inclusive)" htmlFor="audit-to">
        <Input id="audit-to" type="date" value={draft.to ?? ''} onChange={set('to')} />
      </Field>
      <div className="col-span-full flex gap-2">
        <Button type="submit" variant="primary">Apply filters</Button>
        <Button onClick={clear} variant="quiet">Clear</Button>
      </div>
    </form>
  );
}
