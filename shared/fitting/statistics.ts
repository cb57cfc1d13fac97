/**
 * Distribution functions used for confidence regions and goodness-of-fit checks: thin, validated wrappers over
 * the stdlib distribution packages (@stdlib/stats-base-dists-chisquare-* and -f-*), which evaluate the CDFs through
 * the regularised incomplete gamma and beta functions (Abramowitz & Stegun 1964, 26.4.19 and 26.6.2) and invert
 * them with dedicated inverse-incomplete-function kernels.
 */
import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import chisquareQuantile from '@stdlib/stats-base-dists-chisquare-quantile';
import fDistributionCdf from '@stdlib/stats-base-dists-f-cdf';
import fDistributionQuantile from '@stdlib/stats-base-dists-f-quantile';

function assertDegreesOfFreedom(name: string, value: number): void {
  if (!(value > 0) || !Number.isFinite(value)) throw new RangeError(`${name} must be a positive finite number, got ${value}`);
}

function assertProbability(probability: number): void {
  if (!(probability > 0 && probability < 1)) throw new RangeError(`probability must lie strictly between 0 and 1, got ${probability}`);
}

/** CDF of Snedecor's F(d1, d2) at x. */
export function fCdf(x: number, d1: number, d2: number): number {
  assertDegreesOfFreedom('d1', d1);
  assertDegreesOfFreedom('d2', d2);
  if (x <= 0) return 0;
  if (!Number.isFinite(x)) return 1;
  return fDistributionCdf(x, d1, d2);
}

/** CDF of χ²(ν) at x. */
export function chiSquareCdf(x: number, dof: number): number {
  assertDegreesOfFreedom('dof', dof);
  if (x <= 0) return 0;
  if (!Number.isFinite(x)) return 1;
  return chisquareCdf(x, dof);
}

/** Quantile of F(d1, d2): the x with fCdf(x) = probability (e.g. probability 0.95 gives the upper 5 % critical value). */
export function fQuantile(probability: number, d1: number, d2: number): number {
  assertProbability(probability);
  assertDegreesOfFreedom('d1', d1);
  assertDegreesOfFreedom('d2', d2);
  return fDistributionQuantile(probability, d1, d2);
}

/** Quantile of χ²(ν). */
export function chiSquareQuantile(probability: number, dof: number): number {
  assertProbability(probability);
  assertDegreesOfFreedom('dof', dof);
  return chisquareQuantile(probability, dof);
}

/**
 * Two-sided probability of a χ² at least as extreme as the one observed, if the model and the
 * stated uncertainties are right: 2·min(P, 1 − P). Small values mean the reduced χ² is far from 1.
 */
export function chiSquareTwoSidedPValue(chi2: number, dof: number): number {
  const p = chiSquareCdf(chi2, dof);
  return Math.min(1, 2 * Math.min(p, 1 - p));
}
