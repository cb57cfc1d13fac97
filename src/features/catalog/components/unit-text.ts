import { formatSignificant, formatWithUncertainty } from '@shared/format/numbers';
import { convertEpsilon, convertSigma, type EnergyUnit, type LengthUnit } from '@shared/physics/parameter-units';

/** ε (stored as ε/k_B in K) in the chosen unit, with its standard error converted by the same factor. */
export const epsilonText = (epsilonK: number, stdErrK: number | null, unit: EnergyUnit) =>
  formatWithUncertainty(convertEpsilon(epsilonK, unit), stdErrK == null ? null : convertEpsilon(stdErrK, unit), unit);

export const sigmaText = (sigmaAngstrom: number, stdErrAngstrom: number | null, unit: LengthUnit) =>
  formatWithUncertainty(convertSigma(sigmaAngstrom, unit), stdErrAngstrom == null ? null : convertSigma(stdErrAngstrom, unit), unit);

/** A signed difference in the chosen unit ("+0.42 K", "−0.0013 nm"). */
export function signedText(value: number, unit: string, digits = 3): string {
  if (value === 0) return `0 ${unit}`;
  const text = formatSignificant(Math.abs(value), digits);
  return `${value > 0 ? '+' : '−'}${text} ${unit}`;
}

export const epsilonHeader = (unit: EnergyUnit) => (unit === 'K' ? 'ε/k_B (K)' : `ε (${unit})`);
export const sigmaHeader = (unit: LengthUnit) => `σ (${unit})`;

/** A bound without trailing zeros (170 K, 297.15 K). */
export const bound = (x: number) => String(Number(x.toPrecision(6)));
export const temperatureRangeText = (v: { temperatureMinK: number; temperatureMaxK: number }) =>
  `${bound(v.temperatureMinK)}–${bound(v.temperatureMaxK)} K`;
