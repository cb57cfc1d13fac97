import { describe, expect, it } from 'vitest';
import { gamma } from 'mathjs';
import {
  COLLISION_TABLE_RANGE,
  collisionIntegralsExact,
  deflectionAngle,
  omega11,
  omega11Derivative,
  omega22,
  omega22Derivative,
  orbitingParameters,
  transportCrossSections,
} from './collision-integrals';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const logSpaced = (lo: number, hi: number, n: number) =>
  Array.from({ length: n }, (_, i) => (i === n - 1 ? hi : lo * Math.pow(hi / lo, i / (n - 1))));

// Neufeld, Janzen & Aziz, J. Chem. Phys. 57, 1100 (1972), eqs. for Ω(1,1)* and Ω(2,2)*; stated validity
// 0.3 ≤ T* ≤ 100. Coefficients from memory, confirmed against their reproduction in Chung et al.,
// Ind. Eng. Chem. Res. 27, 671 (1988) (A = 1.16145, B = 0.14874, C = 0.52487, D = 0.77320, E = 2.16178,
// F = 2.43787, G = −6.435e−4, H = 7.27371, S = 18.0323, W = −0.76830).
function neufeld11(t: number): number {
  return 1.06036 / t ** 0.1561 + 0.193 * Math.exp(-0.47635 * t) + 1.03587 * Math.exp(-1.52996 * t) + 1.76474 * Math.exp(-3.89411 * t);
}
function neufeld22(t: number): number {
  return (
    1.16145 / t ** 0.14874 +
    0.52487 * Math.exp(-0.7732 * t) +
    2.16178 * Math.exp(-2.43787 * t) -
    6.435e-4 * t ** 0.14874 * Math.sin(18.0323 * t ** -0.7683 - 7.27371)
  );
}

// Kim & Monroe, J. Comput. Phys. 273, 358 (2014): Ω(l,s)* = A + Σ_{k=1..6} [B_k/T*^k + C_k (ln T*)^k],
// fitted to their high-accuracy quadrature with deviations below 0.007 % for 0.3 ≤ T* ≤ 400.
// Coefficients transcribed from the paper's table as reproduced in the open-source `chemicals` Python library.
const KIM_MONROE = {
  omega11: {
    a: -1.1036729,
    b: [2.6431984, 0.0060432255, -0.15158773, 0.054237938, -0.0090468682, 0.00061742007],
    c: [1.6690746, -0.6914589, 0.15502132, -0.020642189, 0.0015402077, -0.000049729535],
  },
  omega22: {
    a: -0.92032979,
    b: [2.3508044, 0.50110649, -0.47193769, 0.15806367, -0.026367184, 0.0018120118],
    c: [1.6330213, -0.69795156, 0.16096572, -0.02210944, 0.0017031434, -0.000056699986],
  },
};
function kimMonroe(kind: 'omega11' | 'omega22', t: number): { value: number; derivative: number } {
  const { a, b, c } = KIM_MONROE[kind];
  const L = Math.log(t);
  let value = a;
  let derivative = 0;
  for (let k = 1; k <= 6; k++) {
    value += b[k - 1] / t ** k + c[k - 1] * L ** k;
    derivative += (-k * b[k - 1]) / t ** (k + 1) + (k * c[k - 1] * L ** (k - 1)) / t;
  }
  return { value, derivative };
}

describe('interpolated Ω(1,1)* and Ω(2,2)* (table from the classical definition)', () => {
  it('agree with the Neufeld–Janzen–Aziz (1972) correlation within 0.2 % over 0.3 ≤ T* ≤ 100', () => {
    for (const t of logSpaced(0.3, 100, 80)) {
      expect(rel(omega11(t), neufeld11(t)), `Ω11 at T*=${t}`).toBeLessThan(2e-3);
      expect(rel(omega22(t), neufeld22(t)), `Ω22 at T*=${t}`).toBeLessThan(2e-3);
    }
  });

  it('agree with the Kim & Monroe (2014) high-accuracy values (their correlation, ±0.007 %) within 0.02 % over 0.3 ≤ T* ≤ 400', () => {
    for (const t of logSpaced(0.3, 400, 60)) {
      expect(rel(omega11(t), kimMonroe('omega11', t).value), `Ω11 at T*=${t}`).toBeLessThan(2e-4);
      expect(rel(omega22(t), kimMonroe('omega22', t).value), `Ω22 at T*=${t}`).toBeLessThan(2e-4);
    }
  });

  it('agree with Bird, Stewart & Lightfoot (2nd ed. 2002) Table E.2 (Monchick & Mason 1961) within 0.1 % for 0.5 ≤ T* ≤ 20', () => {
    // [T*, Ω(2,2)* (viscosity), Ω(1,1)* (diffusivity)], read from the published table.
    // At T* = 0.3 (Ω22 2.840) and T* ≥ 50 the older table differs from Kim & Monroe (2014) by 0.13–0.6 %,
    // and this code follows Kim & Monroe there (previous test), so those rows are not used here.
    const rows: [number, number, number][] = [
      [0.5, 2.284, 2.066],
      [1.0, 1.593, 1.44],
      [3.0, 1.0388, 0.95],
      [5.0, 0.9268, 0.8428],
      [10.0, 0.8244, 0.7422],
      [20.0, 0.7436, 0.664],
    ];
    for (const [t, o22, o11] of rows) {
      expect(rel(omega22(t), o22), `Ω22 at T*=${t}`).toBeLessThan(1e-3);
      expect(rel(omega11(t), o11), `Ω11 at T*=${t}`).toBeLessThan(1e-3);
    }
  });

  it('dΩ*/dT* agrees with the derivative of the Kim & Monroe (2014) correlation within 0.2 % for 0.5 ≤ T* ≤ 100, and with finite differences of the interpolant', () => {
    // Near the ends of its range the correlation's slope is less accurate than its value (1.1 % at T* = 0.3,
    // where a finite difference of omegaExact confirms this code's slope to 3e-5), so the check stops inside.
    for (const t of logSpaced(0.5, 100, 25)) {
      expect(rel(omega22Derivative(t), kimMonroe('omega22', t).derivative), `T*=${t}`).toBeLessThan(2e-3);
      expect(rel(omega11Derivative(t), kimMonroe('omega11', t).derivative), `T*=${t}`).toBeLessThan(2e-3);
      const h = 1e-5 * t;
      expect(rel(omega22Derivative(t), (omega22(t + h) - omega22(t - h)) / (2 * h))).toBeLessThan(1e-6);
    }
  });

  it('interpolation error against the exact computation between table nodes is below 0.02 %', () => {
    // Points chosen off the uniform ln T* grid; exact evaluations take a few seconds each.
    for (const t of [0.83, 6.1, 140]) {
      const exact = collisionIntegralsExact(t);
      expect(rel(omega11(t), exact.omega11), `Ω11 at T*=${t}`).toBeLessThan(2e-4);
      expect(rel(omega22(t), exact.omega22), `Ω22 at T*=${t}`).toBeLessThan(2e-4);
      expect(rel(omega22Derivative(t), exact.dOmega22dT), `dΩ22 at T*=${t}`).toBeLessThan(1e-3);
    }
  });

  it('covers at least 0.2 ≤ T* ≤ 400 and throws a RangeError naming the reduced temperature and range outside', () => {
    expect(COLLISION_TABLE_RANGE.minReducedTemperature).toBeLessThanOrEqual(0.2);
    expect(COLLISION_TABLE_RANGE.maxReducedTemperature).toBeGreaterThanOrEqual(400);
    expect(() => omega22(0.1)).toThrow(RangeError);
    expect(() => omega22(0.1)).toThrow(/reduced temperature.*0\.1.*range/);
    expect(() => omega11(1e4)).toThrow(/range/);
    expect(() => omega22Derivative(Number.NaN)).toThrow(RangeError);
  });
});

describe('deflection angle and cross-sections from the definition', () => {
  it('head-on collisions reverse (χ = π) and large impact parameters follow the small-angle impulse result', () => {
    expect(deflectionAngle(0, 1)).toBe(Math.PI);
    // Impulse approximation for U = α r^−n: χ = √π Γ((n+1)/2)/Γ(n/2) · α/(E b^n)
    // (Landau & Lifshitz, Mechanics, §20 problem 2), summed over the r^−12 and r^−6 terms of 4(r^−12 − r^−6).
    const impulse = (b: number, e: number) => {
      const term = (n: number, alpha: number) =>
        (Math.sqrt(Math.PI) * Number(gamma((n + 1) / 2))) / Number(gamma(n / 2)) * (alpha / (e * b ** n));
      return term(12, 4) + term(6, -4);
    };
    for (const [b, e] of [
      [10, 1],
      [6, 10],
      [20, 0.05],
    ]) {
      const chi = deflectionAngle(b, e);
      // second-order corrections are of relative size |χ|
      expect(rel(chi, impulse(b, e)), `b=${b}, E=${e}`).toBeLessThan(3 * Math.abs(chi) + 1e-6);
    }
  });

  it('orbiting sets in below E* = 0.8 with b* = 1.7544, r* = 1.3077 at the threshold (Hirschfelder et al. 1954 §8.2, from memory)', () => {
    const o = orbitingParameters(0.8 - 1e-12);
    expect(o).not.toBeNull();
    expect(o!.orbitImpactParameter).toBeCloseTo(1.7544, 3);
    expect(o!.orbitRadius).toBeCloseTo(1.3077, 3);
    expect(orbitingParameters(0.8)).toBeNull();
    // just off the orbiting impact parameter the particle circles many times: χ → −∞ logarithmically
    const e = 0.3;
    const bo = orbitingParameters(e)!.orbitImpactParameter;
    expect(deflectionAngle(bo * (1 + 1e-8), e)).toBeLessThan(deflectionAngle(bo * (1 + 1e-4), e));
    expect(deflectionAngle(bo * (1 + 1e-8), e)).toBeLessThan(-2 * Math.PI);
  });

  it('at very high energy the cross-sections fall like those of the r^−12 wall, Q* ∝ E^(−1/6) (common practice, no source)', () => {
    const a = transportCrossSections(1e6);
    const b = transportCrossSections(1e8);
    // the attractive r^−6 term is a correction of relative order E^(−1/2) here
    expect(rel(b.q2 / a.q2, 100 ** (-1 / 6))).toBeLessThan(2e-3);
    expect(rel(b.q1 / a.q1, 100 ** (-1 / 6))).toBeLessThan(2e-3);
  });

  it('rejects a non-positive reduced energy', () => {
    expect(() => transportCrossSections(0)).toThrow(RangeError);
    expect(() => collisionIntegralsExact(-1)).toThrow(/reduced temperature/);
  });
});
