/**
 * The Mie λr-6 potential u(r) = C ε [(σ/r)^λr − (σ/r)^6], C = (λr/(λr − 6)) (λr/6)^(6/(λr − 6))
 * (Mie 1903; in the form of Potoff & Bernard-Brunel, J. Phys. Chem. B 113, 14725, 2009, eq. 1, and Lafitte et al.,
 * J. Chem. Phys. 139, 154504, 2013, eq. 2). C makes the well depth ε for every λr; λr = 12 is the LJ 12-6 potential
 * with C = 4 exactly. The attractive exponent is 6 throughout Epsigma.
 */

/** The repulsive exponent of the Lennard-Jones 12-6 potential. */
export const LJ_REPULSIVE_EXPONENT = 12;
/** Range of λr Epsigma accepts (softer than 8 or harder than 36 is outside what Mie force fields use). */
export const REPULSIVE_EXPONENT_RANGE: readonly [number, number] = [8, 36];

export type PotentialModel = 'lj-12-6' | 'mie';

/** Throws a RangeError naming the value when λr is not a finite number in [8, 36]. */
export function requireRepulsiveExponent(repulsiveExponent: number): void {
  const [lo, hi] = REPULSIVE_EXPONENT_RANGE;
  if (typeof repulsiveExponent !== 'number' || !Number.isFinite(repulsiveExponent) || repulsiveExponent < lo || repulsiveExponent > hi) {
    throw new RangeError(`repulsiveExponent (λr) must be a number from ${lo} to ${hi}, got ${String(repulsiveExponent)}`);
  }
}

/** The prefactor C(λr) of the Mie λr-6 potential (4 for λr = 12). */
export function miePrefactor(repulsiveExponent: number): number {
  if (repulsiveExponent === LJ_REPULSIVE_EXPONENT) return 4;
  const n = repulsiveExponent;
  return (n / (n - 6)) * Math.pow(n / 6, 6 / (n - 6));
}

/** d ln C / dλr, for the analytic λr-derivative of properties. */
export function miePrefactorLogDerivative(repulsiveExponent: number): number {
  const n = repulsiveExponent;
  return 1 / n - 1 / (n - 6) - (6 / ((n - 6) * (n - 6))) * Math.log(n / 6) + 6 / ((n - 6) * n);
}

/** Position of the minimum in units of σ: r_min/σ = (λr/6)^(1/(λr − 6)) (2^(1/6) for λr = 12). */
export function mieMinimumPosition(repulsiveExponent: number): number {
  return Math.pow(repulsiveExponent / 6, 1 / (repulsiveExponent - 6));
}

/** Reduced potential u/ε at x = r/σ. */
export function mieReducedPotential(x: number, repulsiveExponent: number): number {
  return miePrefactor(repulsiveExponent) * (Math.pow(x, -repulsiveExponent) - Math.pow(x, -6));
}

/** The model name shown to people: "LJ 12-6" or "Mie 16-6". */
export function potentialLabel(repulsiveExponent: number): string {
  return repulsiveExponent === LJ_REPULSIVE_EXPONENT ? 'LJ 12-6' : `Mie ${Number(repulsiveExponent.toFixed(3))}-6`;
}
