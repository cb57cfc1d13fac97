/**
 * Distribution functions used for confidence regions and goodness-of-fit checks.
 * F and χ² CDFs via the regularised incomplete beta / gamma functions
 * (Abramowitz & Stegun 1964, 26.6.2 and 26.4.19); quantiles by bisection on the CDF.
 */
import { regularizedGammaP, regularizedIncompleteBeta } from './special-functions';

function assertDegreesOfFreedom(name: string, value: number): void {
  if (!(value > 0) || !Number.isFinite(value)) throw new RangeError(`${name} must be a positive finite number, got ${value}`);
}

function assertProbability(probability: number): void {
  if (!(probability > 0 && probability < 1)) throw new RangeError(`probability must lie strictly between 0 and 1, got ${probability}`);
}

/** CDF of Snedecor's F(d1, d2) at x: I_{d1 x/(d1 x + d2)}(d1/2, d2/2). */
export function fCdf(x: number, d1: number, d2: number): number {
  assertDegreesOfFreedom('d1', d1);
  assertDegreesOfFreedom('d2', d2);
  if (x <= 0) return 0;
  if (!Number.isFinite(x)) return 1;
  return regularizedIncompleteBeta((d1 * x) / (d1 * x + d2), d1 / 2, d2 / 2);
}

/** CDF of χ²(ν) at x: P(ν/2, x/2). */
export function chiSquareCdf(x: number, dof: number): number {
  assertDegreesOfFreedom('dof', dof);
  if (x <= 0) return 0;
  if (!Number.isFinite(x)) return 1;
  return regularizedGammaP(dof / 2, x / 2);
}

/** Inverts a monotone increasing CDF on (0, ∞) by bracketing then bisection to relative precision 1e-12. */
function invertCdf(cdf: (x: number) => number, probability: number): number {
  let lo = 0;
  let hi = 1;
  while (cdf(hi) < probability) {
    lo = hi;
    hi *= 2;
    if (hi > 1e300) throw new Error('quantile search failed to bracket the probability');
  }
  for (let i = 0; i < 2000 && hi - lo > 1e-12 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (cdf(mid) < probability) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** Quantile of F(d1, d2): the x with fCdf(x) = probability (e.g. probability 0.95 gives the upper 5 % critical value). */
export function fQuantile(probability: number, d1: number, d2: number): number {
  assertProbability(probability);
  assertDegreesOfFreedom('d1', d1);
  assertDegreesOfFreedom('d2', d2);
  return invertCdf((x) => fCdf(x, d1, d2), probability);
}

/** Quantile of χ²(ν). */
export function chiSquareQuantile(probability: number, dof: number): number {
  assertProbability(probability);
  assertDegreesOfFreedom('dof', dof);
  return invertCdf((x) => chiSquareCdf(x, dof), probability);
}

/**
 * Two-sided probability of a χ² at least as extreme as the one observed, if the model and the
 * stated uncertainties are right: 2·min(P, 1 − P). Small values mean the reduced χ² is far from 1.
 */
export function chiSquareTwoSidedPValue(chi2: number, dof: number): number {
  const p = chiSquareCdf(chi2, dof);
  return Math.min(1, 2 * Math.min(p, 1 - p));
}
