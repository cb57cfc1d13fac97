import { describe, expect, it } from 'vitest';
import {
  autocorrelation,
  blockingStdErr,
  detectEquilibration,
  estimateCovariance,
  estimateMean,
  statisticalInefficiency,
} from './statistics';
import { Xoshiro128 } from './rng';

/** AR(1) process x_t = φ x_{t−1} + e_t: integrated autocorrelation gives g = (1 + φ)/(1 − φ) (Chodera et al. 2007, eq. 14 ff.; standard result for AR(1)). */
function ar1(n: number, phi: number, seed: number, offset = 0): Float64Array {
  const g = new Xoshiro128(seed);
  const x = new Float64Array(n);
  let v = g.gaussian() / Math.sqrt(1 - phi * phi);
  for (let i = 0; i < n; i++) {
    v = phi * v + g.gaussian();
    x[i] = v + offset;
  }
  return x;
}

describe('statistics', () => {
  it('recovers the statistical inefficiency of an AR(1) series', () => {
    for (const phi of [0, 0.5, 0.9]) {
      const x = ar1(100000, phi, 17);
      const expected = (1 + phi) / (1 - phi);
      // The truncated estimator is within ~10 % for 1e5 samples.
      expect(statisticalInefficiency(x) / expected).toBeGreaterThan(0.85);
      expect(statisticalInefficiency(x) / expected).toBeLessThan(1.15);
    }
  });

  it('gives standard errors that cover the true mean at the stated rate', () => {
    // 200 independent AR(1) series (φ = 0.8, true mean 0): |mean| < 2·SE in about 95 % of them.
    let inside = 0;
    for (let k = 0; k < 200; k++) {
      const e = estimateMean(ar1(2000, 0.8, 1000 + k));
      if (Math.abs(e.mean) < 2 * e.stdErr) inside++;
    }
    expect(inside / 200).toBeGreaterThan(0.88);
    expect(inside / 200).toBeLessThan(0.99);
  });

  it('agrees with blocking (Flyvbjerg & Petersen 1989) on a correlated series', () => {
    const x = ar1(65536, 0.9, 5);
    const se = estimateMean(x).stdErr;
    expect(blockingStdErr(x) / se).toBeGreaterThan(0.8);
    expect(blockingStdErr(x) / se).toBeLessThan(1.25);
  });

  it('detects the end of an initial transient (Chodera 2016)', () => {
    // Exponential relaxation from +20 with time constant 50 samples on top of AR(1) noise: the discard point must
    // fall after the transient has decayed below the noise (t ≳ 150) and well before the end.
    const x = ar1(5000, 0.5, 23);
    for (let i = 0; i < x.length; i++) x[i] += 20 * Math.exp(-i / 50);
    const eq = detectEquilibration(x);
    expect(eq.t0).toBeGreaterThan(100);
    expect(eq.t0).toBeLessThan(800);
    // A stationary series loses (almost) nothing.
    expect(detectEquilibration(ar1(5000, 0.5, 24)).t0).toBeLessThan(500);
  });

  it('estimates a covariance with a standard error', () => {
    // y = 2x + noise, Var(x) = 1/(1 − φ²): Cov(x, y) = 2 Var(x).
    const x = ar1(50000, 0.6, 31);
    const g = new Xoshiro128(32);
    const y = x.map((v) => 2 * v + g.gaussian());
    const c = estimateCovariance(x, y);
    const expected = 2 / (1 - 0.36);
    expect(Math.abs(c.mean - expected)).toBeLessThan(4 * c.stdErr);
    expect(c.stdErr).toBeGreaterThan(0);
  });
});

describe('standard errors of short correlated series (the regime of an NPT run: 40–60 independent samples)', () => {
  it('the spread of means over 400 series matches the mean reported variance', () => {
    // AR(1), φ = 0.9: g = 19 (standard result), 1000 samples hold about 53 independent ones. For an honest
    // estimator the ratio Var(means)/⟨SE²⟩ is 1; with 400 series its own relative noise is sqrt(2/399) ≈ 0.07
    // (χ² with 399 degrees of freedom), so the band [0.8, 1.25] is about ±3 of those (common practice, no source).
    const means: number[] = [];
    let sumSe2 = 0;
    for (let k = 0; k < 400; k++) {
      const e = estimateMean(ar1(1000, 0.9, 5000 + k));
      means.push(e.mean);
      sumSe2 += e.stdErr * e.stdErr;
    }
    const m = means.reduce((a, b) => a + b, 0) / means.length;
    const spread = means.reduce((a, b) => a + (b - m) ** 2, 0) / (means.length - 1);
    const ratio = spread / (sumSe2 / means.length);
    expect(ratio).toBeGreaterThan(0.8);
    expect(ratio).toBeLessThan(1.25);
  });

  it('reports the window of the sum and whether it closed', () => {
    const a = autocorrelation(ar1(5000, 0.5, 3));
    expect(a.reliable).toBe(true);
    expect(a.window).toBeGreaterThanOrEqual(6);
    // A steady drift (a run still equilibrating) stays correlated at every lag: the window cannot close within T/2.
    expect(autocorrelation(Array.from({ length: 40 }, (_, i) => i)).reliable).toBe(false);
  });
});
