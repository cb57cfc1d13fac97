import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { CUTOFF_SCHEME_LABELS, CUTOFF_SCHEMES, type CutoffScheme } from '@shared/physics/cutoff-schemes';
import { FIELD_LABELS } from '@shared/schemas/field-labels';
import { createParameterSetBody, CUTOFF_SIGMA_RANGE, type Validity } from '@shared/schemas/parameter-sets';
import { Button } from '@/components/ui/button';
import { Field, Input, Select, TextArea } from '@/components/ui/field';
import { decimalOf, invalidProps, sameNames, useServerFieldErrors } from '@/lib/forms';
import { useDraftParameterSet, type ParameterSetSummary } from '../api/parameter-sets';
import { FormError } from './form-error';
import { toValidity, VALIDITY_PATHS, validityInputOf, ValidityFields, validityInputShape } from './validity-fields';

const draftFormShape = z.object({
  scheme: z.enum(CUTOFF_SCHEMES),
  cutoffSigma: z.string(),
  validity: validityInputShape,
  rationale: z.string(),
});
type DraftFormValues = z.input<typeof draftFormShape>;

/** The boxes as typed become the request, which createParameterSetBody (the server's schema) then judges. */
const draftFormSchema = (fitId: number) =>
  draftFormShape
    .transform((v): z.input<typeof createParameterSetBody> => {
      const cutoffSigma = v.scheme !== 'full-potential' ? decimalOf(v.cutoffSigma) : undefined;
      return {
        fitId,
        scheme: v.scheme,
        ...(cutoffSigma !== undefined ? { cutoffSigma } : {}),
        validity: toValidity(v.validity),
        rationale: v.rationale,
      };
    })
    .pipe(createParameterSetBody);

/**
 * Drafts a parameter set from a succeeded fit. The validity range starts at the span of the fitted data;
 * the scheme at the fit's (full potential for B2 and viscosity, the simulations' cutoff for densities).
 */
export function DraftParameterSetForm({
  fitId,
  defaults,
  onDrafted,
}: {
  fitId: number;
  defaults: { scheme: CutoffScheme; cutoffSigma: number | null; validity: Validity };
  onDrafted: (set: ParameterSetSummary) => void;
}) {
  const draft = useDraftParameterSet();
  const form = useForm<DraftFormValues, unknown, z.output<typeof createParameterSetBody>>({
    resolver: zodResolver(draftFormSchema(fitId)),
    defaultValues: {
      scheme: defaults.scheme,
      cutoffSigma: String(defaults.cutoffSigma ?? 2.5),
      validity: validityInputOf(defaults.validity),
      rationale: '',
    },
  });
  const errors = form.formState.errors;
  const scheme = useWatch({ control: form.control, name: 'scheme' });
  const unplaced = useServerFieldErrors(draft.error, form.setError, sameNames(['scheme', 'cutoffSigma', 'rationale', ...VALIDITY_PATHS]));
  return (
    <form
      noValidate
      className="grid gap-4"
      aria-label="Draft a parameter set"
      onSubmit={form.handleSubmit((body) => draft.mutate(body, { onSuccess: onDrafted }))}
    >
      <div className="grid gap-3 sm:grid-cols-2">
        <Field
          label={FIELD_LABELS.scheme}
          htmlFor="draft-scheme"
          hint="B2 and dilute-gas viscosity see the whole potential; density fits use their simulations’ cutoff."
          error={errors.scheme?.message}
        >
          <Select id="draft-scheme" {...invalidProps('draft-scheme', errors.scheme?.message)} {...form.register('scheme')}>
            {CUTOFF_SCHEMES.map((s) => (
              <option key={s} value={s}>
                {CUTOFF_SCHEME_LABELS[s]}
              </option>
            ))}
          </Select>
        </Field>
        {scheme !== 'full-potential' && (
          <Field
            label={FIELD_LABELS.cutoffSigma}
            htmlFor="draft-cutoff"
            hint={`${CUTOFF_SIGMA_RANGE.min} to ${CUTOFF_SIGMA_RANGE.max} σ`}
            error={errors.cutoffSigma?.message}
          >
            <Input
              id="draft-cutoff"
              inputMode="decimal"
              {...invalidProps('draft-cutoff', errors.cutoffSigma?.message)}
              {...form.register('cutoffSigma')}
            />
          </Field>
        )}
      </div>
      <ValidityFields
        idPrefix="draft"
        register={(k) => form.register(`validity.${k}`)}
        errors={errors.validity}
        hint="Starts at the span of the fitted data."
      />
      <Field
        label={FIELD_LABELS.rationale}
        htmlFor="draft-rationale"
        hint="Why these values, for what use; the reviewer reads this first."
        error={errors.rationale?.message}
      >
        <TextArea
          id="draft-rationale"
          rows={3}
          {...invalidProps('draft-rationale', errors.rationale?.message)}
          {...form.register('rationale')}
        />
      </Field>
      <FormError error={draft.error} unplaced={unplaced} />
      <div>
        <Button type="submit" variant="primary" busy={draft.isPending}>
          Draft parameter set
        </Button>
      </div>
    </form>
  );
}
