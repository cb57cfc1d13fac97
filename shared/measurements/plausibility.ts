/**
 * Plausibility of measured values in canonical units, beyond "is a finite number": a value outside the hard
 * range is refused (no fluid state has it, so it is a typing or unit mistake), a value inside it but outside the
 * usual range is accepted with a warning. Ranges are generous on purpose: they catch exponents and unit
 * slips (a factor 1000 or 10⁶), not unusual science. Sources: common practice, no source, unless named.
 * Fields without an entry here (new kinds) are checked for finiteness only.
 */
import type { CanonicalField } from './property-kinds';

export interface PlausibleRange {
  /** Refused outside [hardMin, hardMax]. */
  hardMin: number;
  hardMax: number;
  /** Warned outside [usualMin, usualMax]. */
  usualMin: number;
  usualMax: number;
  unit: string;
  /** Why the usual range is what it is, for the message. */
  usual: string;
}

export const PLAUSIBLE_RANGES: Partial<Record<CanonicalField, PlausibleRange>> = {
  temperatureK: {
    hardMin: 0,
    hardMax: 1e5,
    usualMin: 1,
    usualMax: 5000,
    unit: 'K',
    usual: 'fluid measurements lie between 1 K and 5000 K',
  },
  pressureMPa: {
    hardMin: 0,
    hardMax: 1e5,
    usualMin: 1e-9,
    usualMax: 5000,
    unit: 'MPa',
    usual: 'fluid measurements lie below 5000 MPa (5 GPa)',
  },
  // |B2| reaches a few thousand cm³/mol for heavy or polar vapours near their triple point (water, n-alkanes:
  // from memory) and a few tens positive for helium-like gases at high temperature (from memory).
  b2Cm3PerMol: {
    hardMin: -1e9,
    hardMax: 1e9,
    usualMin: -2e4,
    usualMax: 500,
    unit: 'cm³/mol',
    usual: 'measured gases have B2 between about −20 000 and +500 cm³/mol',
  },
  uB2Cm3PerMol: {
    hardMin: 0,
    hardMax: 1e9,
    usualMin: 0,
    usualMax: 2e4,
    unit: 'cm³/mol',
    usual: 'uncertainties of B2 stay below 20 000 cm³/mol',
  },
  // The densest liquid metal, mercury, is 13 534 kg/m³ at 298 K (from memory); no fluid exceeds 30 000 kg/m³.
  densityKgPerM3: {
    hardMin: 0,
    hardMax: 1e6,
    usualMin: 1e-6,
    usualMax: 3e4,
    unit: 'kg/m³',
    usual: 'fluid densities lie below 30 000 kg/m³',
  },
  uDensityKgPerM3: {
    hardMin: 0,
    hardMax: 1e6,
    usualMin: 0,
    usualMax: 3e4,
    unit: 'kg/m³',
    usual: 'uncertainties of density stay below 30 000 kg/m³',
  },
  // Dilute gases: about 1–100 µPa·s (from memory); 10⁵ µPa·s = 0.1 Pa·s is already a viscous liquid.
  viscosityMicroPaS: {
    hardMin: 0,
    hardMax: 1e12,
    usualMin: 0.1,
    usualMax: 1e5,
    unit: 'µPa·s',
    usual: 'dilute-gas viscosities lie between 0.1 and 100 000 µPa·s',
  },
  uViscosityMicroPaS: {
    hardMin: 0,
    hardMax: 1e12,
    usualMin: 0,
    usualMax: 1e5,
    unit: 'µPa·s',
    usual: 'uncertainties of viscosity stay below 100 000 µPa·s',
  },
};

export type Plausibility = { verdict: 'ok' } | { verdict: 'refuse' | 'warn'; message: string };

const show = (v: number) => (Math.abs(v) >= 1e6 || (Math.abs(v) < 1e-3 && v !== 0) ? v.toExponential(3) : String(Number(v.toPrecision(6))));

/** Judges one converted value of a canonical field. */
export function judgeValue(field: CanonicalField, value: number, label: string): Plausibility {
  const r = PLAUSIBLE_RANGES[field];
  if (!r) return { verdict: 'ok' };
  if (value < r.hardMin || value > r.hardMax) {
    return {
      verdict: 'refuse',
      message: `${label} ${show(value)} ${r.unit} is impossible for a fluid (accepted: ${show(r.hardMin)} to ${show(r.hardMax)} ${r.unit}; ${r.usual}). Check the number and the unit in the header.`,
    };
  }
  if (value < r.usualMin || value > r.usualMax)
    return { verdict: 'warn', message: `${label} ${show(value)} ${r.unit} is unusual: ${r.usual}.` };
  return { verdict: 'ok' };
}

/**
 * A hint when a whole column looks written in another unit than its header says: the values would be usual if
 * divided (or multiplied) by a power of ten that unit mix-ups produce (10³: L vs m³, g vs kg; 10⁶: cm³ vs m³).
 */
export function unitSlipHint(field: CanonicalField, values: number[], unitText: string): string | null {
  const r = PLAUSIBLE_RANGES[field];
  if (!r || values.length === 0) return null;
  const usual = (v: number) => v >= r.usualMin && v <= r.usualMax;
  // A unit slip moves the whole column: only then is it suspected.
  if (values.some(usual)) return null;
  for (const factor of [1e6, 1e-6, 1e3, 1e-3]) {
    if (values.every((v) => usual(v / factor))) {
      const times =
        factor > 1
          ? `${factor === 1e6 ? 'a million' : 'a thousand'} times too large`
          : `${factor === 1e-6 ? 'a million' : 'a thousand'} times too small`;
      return `With the unit "${unitText}" these values are ${times} (${r.usual}); is the unit in the header right?`;
    }
  }
  return null;
}
