import { describe, expect, it } from 'vitest';
import {
  GAUSS10_WEIGHTS,
  KRONROD21_NODES,
  KRONROD21_WEIGHTS,
  integrate,
  integrateToInfinity,
  integrateVector,
  integrateVectorToInfinity,
} from './quadrature';

/** Legendre P_n(x) and P_n'(x) by the three-term recurrence (Abramowitz & Stegun 1964, 22.7.10 and 22.8.5). */
function legendre(n: number, x: number): { p: number; dp: number } {
  let p0 = 1;
  let p1 = x;
  for (let k = 2; k <= n; k++) {
    const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
    p0 = p1;
    p1 = p2;
  }
  return { p: p1, dp: (n * (x * p1 - p0)) / (x * x - 1) };
}

describe('G10K21 rule tables (Piessens et al. 1983, QUADPACK QK21)', () => {
  it('Gauss nodes are the zeros of P10 and the Gauss weights are 2/((1−x²)P10′(x)²) (Abramowitz & Stegun 1964, 25.4.29)', () => {
    for (let i = 0; i < 5; i++) {
      const x = KRONROD21_NODES[2 * i + 1];
      const { p, dp } = legendre(10, x);
      expect(Math.abs(p)).toBeLessThan(1e-14);
      expect(GAUSS10_WEIGHTS[i]).toBeCloseTo(2 / ((1 - x * x) * dp * dp), 14);
    }
  });

  it('both rules integrate a constant exactly (weights sum to 2)', () => {
    const kronrod = 2 * KRONROD21_WEIGHTS.slice(0, 10).reduce((s, w) => s + w, 0) + KRONROD21_WEIGHTS[10];
    const gauss = 2 * GAUSS10_WEIGHTS.reduce((s, w) => s + w, 0);
    expect(kronrod).toBeCloseTo(2, 14);
    expect(gauss).toBeCloseTo(2, 14);
  });

  it('one K21 panel is exact for polynomials up to degree 31 (3n+1 for n = 10; Kronrod 1965)', () => {
    // ∫_0^1 x^k dx = 1/(k+1), closed form; a single panel is used when the tolerance is loose.
    for (const k of [0, 7, 20, 31]) {
      const r = integrate((x) => x ** k, 0, 1, { relativeTolerance: 1, maxSubintervals: 1 });
      expect(r.subintervals).toBe(1);
      expect(Math.abs(r.value - 1 / (k + 1)) * (k + 1)).toBeLessThan(1e-14);
    }
  });
});

describe('adaptive integration against closed forms', () => {
  it('∫_0^π sin x dx = 2', () => {
    const r = integrate(Math.sin, 0, Math.PI, { relativeTolerance: 1e-13 });
    expect(r.converged).toBe(true);
    expect(Math.abs(r.value - 2)).toBeLessThan(1e-13);
  });

  it('endpoint singularities: ∫_0^1 ln x dx = −1, ∫_0^1 x^(−1/2) dx = 2', () => {
    const r1 = integrate(Math.log, 0, 1, { relativeTolerance: 1e-11 });
    expect(Math.abs(r1.value + 1)).toBeLessThan(1e-10);
    const r2 = integrate((x) => 1 / Math.sqrt(x), 0, 1, { relativeTolerance: 1e-10 });
    expect(Math.abs(r2.value - 2)).toBeLessThan(1e-9);
  });

  it('a kink declared as a breakpoint: ∫_−1^2 |x| dx = 5/2', () => {
    const r = integrate(Math.abs, -1, 2, { relativeTolerance: 1e-14, maxSubintervals: 2 }, [0]);
    expect(r.subintervals).toBe(2);
    expect(Math.abs(r.value - 2.5)).toBeLessThan(1e-14);
  });

  it('sharp peak: ∫_−1^1 1/(x² + 1e−6) dx = 2·1000·atan(1000)', () => {
    const exact = 2000 * Math.atan(1000);
    const r = integrate((x) => 1 / (x * x + 1e-6), -1, 1, { relativeTolerance: 1e-12 });
    expect(Math.abs(r.value / exact - 1)).toBeLessThan(1e-11);
  });

  it('reports non-convergence instead of a silent wrong answer', () => {
    const r = integrate((x) => Math.sin(1 / x), 1e-8, 1, { relativeTolerance: 1e-14, maxSubintervals: 20 });
    expect(r.converged).toBe(false);
  });

  it('rejects invalid tolerances', () => {
    expect(() => integrate(Math.sin, 0, 1, { relativeTolerance: 0, absoluteTolerance: 0 })).toThrow(RangeError);
    expect(() => integrate(Math.sin, 0, 1, { relativeTolerance: Number.NaN })).toThrow(RangeError);
  });
});

describe('semi-infinite intervals (QAGI transformation)', () => {
  it('∫_0^∞ e^−x dx = 1, ∫_0^∞ dx/(1+x²) = π/2, ∫_0^∞ x² e^(−x²) dx = √π/4', () => {
    expect(Math.abs(integrateToInfinity((x) => Math.exp(-x), 0, { relativeTolerance: 1e-13 }).value - 1)).toBeLessThan(1e-12);
    expect(Math.abs(integrateToInfinity((x) => 1 / (1 + x * x), 0, { relativeTolerance: 1e-13 }).value - Math.PI / 2)).toBeLessThan(1e-12);
    const g = integrateToInfinity((x) => x * x * Math.exp(-x * x), 0, { relativeTolerance: 1e-13 }).value;
    expect(Math.abs(g - Math.sqrt(Math.PI) / 4)).toBeLessThan(1e-13);
  });

  it('∫_2^∞ x^−4 dx = 1/24 with a shifted lower limit', () => {
    const r = integrateToInfinity((x) => x ** -4, 2, { relativeTolerance: 1e-13 });
    expect(Math.abs(r.value * 24 - 1)).toBeLessThan(1e-12);
  });
});

describe('vector-valued integrands', () => {
  it('Gamma-function moments ∫_0^∞ x^k e^−x dx = k! for k = 0..4 in one pass', () => {
    const r = integrateVectorToInfinity((x) => [0, 1, 2, 3, 4].map((k) => x ** k * Math.exp(-x)), 0, 5, { relativeTolerance: 1e-12 });
    expect(r.converged).toBe(true);
    [1, 1, 2, 6, 24].forEach((exact, k) => expect(Math.abs(r.values[k] / exact - 1)).toBeLessThan(1e-11));
  });

  it('each component meets its own tolerance: ∫_0^1 (cos, 1e−8·x) = (sin 1, 5e−9)', () => {
    const r = integrateVector((x) => [Math.cos(x), 1e-8 * x], 0, 1, 2, { relativeTolerance: 1e-12 });
    expect(Math.abs(r.values[0] - Math.sin(1))).toBeLessThan(1e-12);
    expect(Math.abs(r.values[1] / 5e-9 - 1)).toBeLessThan(1e-12);
  });
});
