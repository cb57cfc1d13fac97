import type { FieldError, UseFormRegisterReturn } from 'react-hook-form';
import { z } from 'zod';
import type { Validity } from '@shared/schemas/parameter-sets';
import { FIELD_LABELS } from '@shared/schemas/field-labels';
import { Field, Input } from '@/components/ui/field';
import { decimalOf, invalidProps } from '@/lib/forms';

export interface ValidityInput {
  temperatureMinK: string;
  temperatureMaxK: string;
  pressureMinMPa: string;
  pressureMaxMPa: string;
}

/** The four boxes as typed; the request schemas (validitySchema inside them) judge what toValidity makes of them. */
export const validityInputShape = z.object({
  temperatureMinK: z.string(),
  temperatureMaxK: z.string(),
  pressureMinMPa: z.string(),
  pressureMaxMPa: z.string(),
});

export const validityInputOf = (v: {
  temperatureMinK: number;
  temperatureMaxK: number;
  pressureMinMPa?: number | null;
  pressureMaxMPa?: number | null;
}): ValidityInput => ({
  temperatureMinK: String(v.temperatureMinK),
  temperatureMaxK: String(v.temperatureMaxK),
  pressureMinMPa: v.pressureMinMPa == null ? '' : String(v.pressureMinMPa),
  pressureMaxMPa: v.pressureMaxMPa == null ? '' : String(v.pressureMaxMPa),
});

/** The form's strings as the API's validity object; NaN for a box that holds no number, which the request schema refuses. */
export function toValidity(v: ValidityInput): Validity {
  const out: Validity = {
    temperatureMinK: decimalOf(v.temperatureMinK) ?? Number.NaN,
    temperatureMaxK: decimalOf(v.temperatureMaxK) ?? Number.NaN,
  };
  if (v.pressureMinMPa.trim() || v.pressureMaxMPa.trim())
    Object.assign(out, { pressureMinMPa: decimalOf(v.pressureMinMPa), pressureMaxMPa: decimalOf(v.pressureMaxMPa) });
  return out;
}

/** The request paths of the four boxes (server refusals name them so). */
export const VALIDITY_PATHS = [
  'validity',
  'validity.temperatureMinK',
  'validity.temperatureMaxK',
  'validity.pressureMinMPa',
  'validity.pressureMaxMPa',
] as const;

type ValidityErrors = Partial<Record<keyof ValidityInput, FieldError>> & { message?: string };

/** The four boxes of a range of validity, registered by the form as `validity.*`, each with its message beside it. */
export function ValidityFields({
  idPrefix,
  register,
  errors,
  hint,
}: {
  idPrefix: string;
  register: (k: keyof ValidityInput) => UseFormRegisterReturn;
  errors?: ValidityErrors;
  hint?: string;
}) {
  const box = (k: keyof ValidityInput, id: string) => (
    <Input id={id} inputMode="decimal" {...invalidProps(id, errors?.[k]?.message)} {...register(k)} />
  );
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <Field
        label={FIELD_LABELS['validity.temperatureMinK']}
        htmlFor={`${idPrefix}-tmin`}
        hint={hint}
        error={errors?.temperatureMinK?.message ?? errors?.message}
      >
        {box('temperatureMinK', `${idPrefix}-tmin`)}
      </Field>
      <Field label={FIELD_LABELS['validity.temperatureMaxK']} htmlFor={`${idPrefix}-tmax`} error={errors?.temperatureMaxK?.message}>
        {box('temperatureMaxK', `${idPrefix}-tmax`)}
      </Field>
      <Field
        label="Pressure from (MPa, optional)"
        htmlFor={`${idPrefix}-pmin`}
        hint="Only where density data back the set."
        error={errors?.pressureMinMPa?.message}
      >
        {box('pressureMinMPa', `${idPrefix}-pmin`)}
      </Field>
      <Field label="Pressure to (MPa, optional)" htmlFor={`${idPrefix}-pmax`} error={errors?.pressureMaxMPa?.message}>
        {box('pressureMaxMPa', `${idPrefix}-pmax`)}
      </Field>
    </div>
  );
}
