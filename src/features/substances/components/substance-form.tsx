import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { createSubstanceBody } from '@shared/schemas/measurements';
import { Button } from '@/components/ui/button';
import { Field, Input, TextArea } from '@/components/ui/field';
import { decimalOf, invalidProps, sameNames, useServerFieldErrors } from '@/lib/forms';
import type { SubstanceInput } from '../api/substances';

const formShape = z.object({ name: z.string(), formula: z.string(), description: z.string(), molarMassGPerMol: z.string() });
type FormValues = z.input<typeof formShape>;

/** The boxes as typed become the request, judged by createSubstanceBody: the same schema the server validates with. */
const formSchema = formShape
  .transform((v): z.input<typeof createSubstanceBody> => ({
    name: v.name,
    formula: v.formula,
    description: v.description,
    molarMassGPerMol: decimalOf(v.molarMassGPerMol) ?? Number.NaN,
  }))
  .pipe(createSubstanceBody);

const FIELDS = ['name', 'formula', 'description', 'molarMassGPerMol'] as const;

/** Create or edit a substance. The server validates again with the shared zod schema. */
export function SubstanceForm({
  initial,
  submitLabel,
  busy,
  error,
  onSubmit,
  molarMassLocked,
}: {
  initial?: Partial<SubstanceInput>;
  submitLabel: string;
  busy: boolean;
  error: Error | null;
  onSubmit: (v: SubstanceInput) => void;
  molarMassLocked?: boolean;
}) {
  const form = useForm<FormValues, unknown, SubstanceInput>({
    resolver: zodResolver(formSchema),
    defaultValues: {
      name: initial?.name ?? '',
      formula: initial?.formula ?? '',
      description: initial?.description ?? '',
      molarMassGPerMol: initial?.molarMassGPerMol ? String(initial.molarMassGPerMol) : '',
    },
  });
  const errors = form.formState.errors;
  const unplaced = useServerFieldErrors(error, form.setError, sameNames(FIELDS));
  return (
    <form noValidate className="grid gap-4" onSubmit={form.handleSubmit((v) => onSubmit(v))}>
      <Field label="Name" htmlFor="substance-name" error={errors.name?.message}>
        <Input id="substance-name" {...invalidProps('substance-name', errors.name?.message)} {...form.register('name')} />
      </Field>
      <Field
        label="Molar mass (g/mol)"
        htmlFor="substance-molar-mass"
        hint={molarMassLocked ? 'Fixed: stored densities depend on it.' : 'Needed to convert molar densities and for viscosities.'}
        error={errors.molarMassGPerMol?.message}
      >
        <Input
          id="substance-molar-mass"
          inputMode="decimal"
          readOnly={molarMassLocked}
          {...invalidProps('substance-molar-mass', errors.molarMassGPerMol?.message)}
          {...form.register('molarMassGPerMol')}
        />
      </Field>
      <Field label="Formula (optional)" htmlFor="substance-formula" error={errors.formula?.message}>
        <Input id="substance-formula" {...invalidProps('substance-formula', errors.formula?.message)} {...form.register('formula')} />
      </Field>
      <Field label="Description (optional)" htmlFor="substance-description" error={errors.description?.message}>
        <TextArea
          id="substance-description"
          rows={3}
          {...invalidProps('substance-description', errors.description?.message)}
          {...form.register('description')}
        />
      </Field>
      {error && (
        <p role="alert" className="text-sm text-changes">
          {error.message}
          {unplaced.map((d) => ` ${d.message}`).join('')}
        </p>
      )}
      <div>
        <Button type="submit" variant="primary" busy={busy}>
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
