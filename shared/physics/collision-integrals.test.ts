import { describe, expect, it } from 'vitest';
import { gamma } from 'mathjs';
import {
  COLLISION_TABLE_RANGE,
  collisionIntegralsExact,
  deflectionAngle,
  omega11,
  omega22,
  omega22Derivative,
  orbitingParameters,
  transportCrossSections,
} from './collision-integrals';

import { COLLISION_INTEGRAL_CHECKS } from '../validation/checks/transport-checks';
import { logSpaced } from '../validation/independent-references';
import { itPassesReferenceChecks } from '../validation/reference-check-tests';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('interpolated Ω(1,1)* and Ω(2,2)* (table from the classical definition)', () => {
  // Against the Neufeld–Janzen–Aziz (1972) correlation (0.2 %, 0.3 ≤ T* ≤ 100), the Kim & Monroe (2014) correlation
  // (0.02 %, 0.3 ≤ T* ≤ 400; its slope 0.2 %, 0.5 ≤ T* ≤ 100), Bird, Stewart & Lightfoot (2002) Table E.2 (0.1 %) and the
  // orbiting threshold of HCB 1954 §8.2: registry entries (shared/validation/checks/transport-checks.ts).
  itPassesReferenceChecks(COLLISION_INTEGRAL_CHECKS);

  it('dΩ(2,2)*/dT* agrees with finite differences of the interpolant', () => {
    for (const t of logSpaced(0.5, 100, 25)) {
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
        ((Math.sqrt(Math.PI) * Number(gamma((n + 1) / 2))) / Number(gamma(n / 2))) * (alpha / (e * b ** n));
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

  it('orbiting sets in below E* = 0.8 (b* and r* at the threshold: registry entries collision.orbiting.*, run above)', () => {
    expect(orbitingParameters(0.8 - 1e-12)).not.toBeNull();
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
