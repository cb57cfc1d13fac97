import type { Validity } from '@shared/schemas/parameter-sets';
import { Field, Input } from '@/components/ui/field';

export interface ValidityInput {
  temperatureMinK: string;
  temperatureMaxK: string;
  pressureMinMPa: string;
  pressureMaxMPa: string;
}

const num = (s: string) => Number(s.trim().replace(',', '.'));

export const validityInputOf = (v: { temperatureMinK: number; temperatureMaxK: number; pressureMinMPa?: number | null; pressureMaxMPa?: number | null }): ValidityInput => ({
  temperatureMinK: String(v.temperatureMinK),
  temperatureMaxK: String(v.temperatureMaxK),
  pressureMinMPa: v.pressureMinMPa == null ? '' : String(v.pressureMinMPa),
  pressureMaxMPa: v.pressureMaxMPa == null ? '' : String(v.pressureMaxMPa),
});

/** The form's strings as the API's validity object (the server checks the ranges again). */
export function toValidity(v: ValidityInput): Validity {
  const out: Validity = { temperatureMinK: num(v.temperatureMinK), temperatureMaxK: num(v.temperatureMaxK) };
  if (v.pressureMinMPa.trim() || v.pressureMaxMPa.trim()) Object.assign(out, { pressureMinMPa: num(v.pressureMinMPa), pressureMaxMPa: num(v.pressureMaxMPa) });
  return out;
}

export function ValidityFields({ idPrefix, value, onChange, hint }: { idPrefix: string; value: ValidityInput; onChange: (v: ValidityInput) => void; hint?: string }) {
  const set = (k: keyof ValidityInput) => (e: React.ChangeEvent<HTMLInputElement>) => onChange({ ...value, [k]: e.target.value });
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <Field label="Valid from (K)" htmlFor={`${idPrefix}-tmin`} hint={hint}>
        <Input id={`${idPrefix}-tmin`} inputMode="decimal" value={value.temperatureMinK} onChange={set('temperatureMinK')} />
      </Field>
      <Field label="Valid to (K)" htmlFor={`${idPrefix}-tmax`}>
        <Input id={`${idPrefix}-tmax`} inputMode="decimal" value={value.temperatureMaxK} onChange={set('temperatureMaxK')} />
      </Field>
      <Field label="Pressure from (MPa, optional)" htmlFor={`${idPrefix}-pmin`} hint="Only where density data back the set.">
        <Input id={`${idPrefix}-pmin`} inputMode="decimal" value={value.pressureMinMPa} onChange={set('pressureMinMPa')} />
      </Field>
      <Field label="Pressure to (MPa, optional)" htmlFor={`${idPrefix}-pmax`}>
        <Input id={`${idPrefix}-pmax`} inputMode="decimal" value={value.pressureMaxMPa} onChange={set('pressureMaxMPa')} />
      </Field>
    </div>
  );
}
