import { describe, expect, it } from 'vitest';
import { Xoshiro128 } from './rng';
import { chiSquaredDeviate } from './thermostat';
import { MD_CHECKS } from '../../validation/checks/md-checks';
import { itPassesReferenceChecks } from '../../validation/reference-check-tests';

describe('Xoshiro128 (xoshiro128**)', () => {
  // The reference C implementation from state {1, 2, 3, 4} (Blackman & Vigna, xoshiro128starstar.c, compiled with gcc;
  // the same six numbers are the reference vector of the Rust crate rand_xoshiro, from memory): registry entries
  // md.xoshiro128.* (XOSHIRO128_REFERENCE), each output exact.
  itPassesReferenceChecks(MD_CHECKS.filter((c) => c.id.startsWith('md.xoshiro128.')));

  it('repeats exactly for one seed and differs for another', () => {
    const a = new Xoshiro128(42);
    const b = new Xoshiro128(42);
    const c = new Xoshiro128(43);
    const xa = Array.from({ length: 100 }, () => a.uniform());
    expect(Array.from({ length: 100 }, () => b.uniform())).toEqual(xa);
    expect(Array.from({ length: 100 }, () => c.uniform())).not.toEqual(xa);
  });

  it('gives uniform deviates in [0, 1) with mean 1/2 and variance 1/12', () => {
    // Moments of U(0,1): mean 1/2, variance 1/12 (any statistics text). n = 2e5: SE(mean) = 6.5e-4.
    const g = new Xoshiro128(7);
    const n = 200000;
    let s = 0;
    let s2 = 0;
    let min = 1;
    let max = 0;
    for (let i = 0; i < n; i++) {
      const u = g.uniform();
      s += u;
      s2 += u * u;
      min = Math.min(min, u);
      max = Math.max(max, u);
    }
    const m = s / n;
    expect(min).toBeGreaterThanOrEqual(0);
    expect(max).toBeLessThan(1);
    expect(Math.abs(m - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(s2 / n - m * m - 1 / 12)).toBeLessThan(0.002);
  });

  it('gives standard normal deviates (mean 0, variance 1, kurtosis 3)', () => {
    // Moments of N(0,1): E[x²] = 1, E[x⁴] = 3. n = 2e5: SE(mean) = 2.2e-3, SE(var) = 3.2e-3, SE(E x⁴) ≈ 0.02.
    const g = new Xoshiro128(11);
    const n = 200000;
    let s = 0;
    let s2 = 0;
    let s4 = 0;
    for (let i = 0; i < n; i++) {
      const x = g.gaussian();
      s += x;
      s2 += x * x;
      s4 += x * x * x * x;
    }
    expect(Math.abs(s / n)).toBeLessThan(0.01);
    expect(Math.abs(s2 / n - 1)).toBeLessThan(0.013);
    expect(Math.abs(s4 / n - 3)).toBeLessThan(0.1);
  });

  it('gives χ² deviates with mean k and variance 2k (used by the CSVR thermostat)', () => {
    // χ²(k): mean k, variance 2k (Abramowitz & Stegun 26.4). k = 1497 (N = 500 atoms), n = 20000 draws.
    const g = new Xoshiro128(3);
    const k = 1497;
    const n = 20000;
    let s = 0;
    let s2 = 0;
    for (let i = 0; i < n; i++) {
      const x = chiSquaredDeviate(k, g);
      s += x;
      s2 += x * x;
    }
    const m = s / n;
    const v = s2 / n - m * m;
    expect(Math.abs(m - k)).toBeLessThan(4 * Math.sqrt((2 * k) / n));
    expect(Math.abs(v / (2 * k) - 1)).toBeLessThan(0.05);
  });
});
