import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field, Input, TextArea } from '@/components/ui/field';
import type { ApiErrorDetail } from '@/lib/api-client';
import { ApiError } from '@/lib/api-client';
import type { SubstanceInput } from '../api/substances';

type FormValues = { name: string; formula: string; description: string; molarMassGPerMol: string };

/** Create or edit a substance. The server validates again with the shared zod schema. */
export function SubstanceForm({ initial, submitLabel, busy, error, onSubmit, molarMassLocked }: { initial?: Partial<SubstanceInput>; submitLabel: string; busy: boolean; error: Error | null; onSubmit: (v: SubstanceInput) => void; molarMassLocked?: boolean }) {
  const form = useForm<FormValues>({
    defaultValues: { name: initial?.name ?? '', formula: initial?.formula ?? '', description: initial?.description ?? '', molarMassGPerMol: initial?.molarMassGPerMol ? String(initial.molarMassGPerMol) : '' },
  });
  const errors = form.formState.errors;
  const serverField = (f: string) => (error instanceof ApiError ? error.details?.find((d: ApiErrorDetail) => d.field === f)?.message : undefined);
  return (
    <form
      noValidate
      className="grid gap-4"
      onSubmit={form.handleSubmit((v) =>
        onSubmit({ name: v.name.trim(), molarMassGPerMol: Number(v.molarMassGPerMol.replace(',', '.')), formula: v.formula.trim() || undefined, description: v.description.trim() || undefined }),
      )}
    >
      <Field label="Name" htmlFor="substance-name" error={errors.name?.message ?? serverField('name')}>
        <Input id="substance-name" aria-invalid={!!errors.name} {...form.register('name', { required: 'is required', maxLength: { value: 120, message: 'at most 120 characters' } })} />
      </Field>
      <Field label="Molar mass (g/mol)" htmlFor="substance-molar-mass" hint={molarMassLocked ? 'Fixed: stored densities depend on it.' : 'Needed to convert molar densities and for viscosities.'} error={errors.molarMassGPerMol?.message ?? serverField('molarMassGPerMol')}>
        <Input
          id="substance-molar-mass"
          inputMode="decimal"
          disabled={molarMassLocked}
          aria-invalid={!!errors.molarMassGPerMol}
          {...form.register('molarMassGPerMol', { validate: (v) => (Number(v.replace(',', '.')) > 0 ? true : 'must be a positive number of g/mol') })}
        />
      </Field>
      <Field label="Formula (optional)" htmlFor="substance-formula">
        <Input id="substance-formula" {...form.register('formula')} />
      </Field>
      <Field label="Description (optional)" htmlFor="substance-description">
        <TextArea id="substance-description" rows={3} {...form.register('description')} />
      </Field>
      {error && <p role="alert" className="text-sm text-changes">{error.message}</p>}
      <div>
        <Button type="submit" variant="primary" busy={busy}>{submitLabel}</Button>
      </div>
    </form>
  );
}
