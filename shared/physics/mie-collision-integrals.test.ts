import { describe, expect, it } from 'vitest';
import {
  deflectionAngle,
  omega11,
  omega11Derivative,
  omega22,
  omega22Derivative,
  orbitingParameters,
  transportCrossSections,
} from './collision-integrals';
import {
  MIE_COLLISION_TABLE_RANGE,
  mieCollisionIntegrals,
  mieCollisionIntegralsExact,
  mieDeflectionAngle,
  mieOrbitingEnergy,
  mieOrbitingParameters,
  mieTransportCrossSections,
} from './mie-collision-integrals';
import { miePrefactor } from './mie-potential';
import { viscosityWithGradient } from './viscosity';
import { MIE_CROSS_SECTION_CHECKS } from '../validation/checks/mie-transport-checks';
import { itPassesReferenceChecks } from '../validation/reference-check-tests';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const logSpaced = (lo: number, hi: number, n: number) =>
  Array.from({ length: n }, (_, i) => (i === n - 1 ? hi : lo * Math.pow(hi / lo, i / (n - 1))));

// The independent reference for the Mie code is a classical quadrature written separately in Python (scipy QUADPACK,
// scripts/reference/mie-cross-sections.py); its cross-sections are entries of the validation registry
// (shared/validation/checks/mie-transport-checks.ts), asserted below. No published table of Mie λr-6 collision integrals
// was at hand (Fokin, Popov & Kalashnikov 1999 fit (m-6) potentials; their coefficients are not quoted from memory).

describe('Mie λr-6 collision integrals: λr = 12 is the 12-6 code', () => {
  it('the interpolated values at λr = 12 are those of the 12-6 table to the last digit', () => {
    for (const t of logSpaced(MIE_COLLISION_TABLE_RANGE.minReducedTemperature, MIE_COLLISION_TABLE_RANGE.maxReducedTemperature, 41)) {
      const m = mieCollisionIntegrals(t, 12);
      expect(m.omega11).toBe(omega11(t));
      expect(m.omega22).toBe(omega22(t));
      expect(m.dOmega11dT).toBe(omega11Derivative(t));
      expect(m.dOmega22dT).toBe(omega22Derivative(t));
      expect(viscosityWithGradient(t * 150, 150, 3.7, 58.1, { repulsiveExponent: 12 })).toEqual(
        viscosityWithGradient(t * 150, 150, 3.7, 58.1),
      );
    }
  });

  it('the general Mie deflection angle and cross-sections at λr = 12 equal the 12-6 code within 1e-10, the deflection quadrature tolerance', () => {
    for (const E of [0.05, 0.3, 0.79, 1, 5, 200]) {
      const bo = orbitingParameters(E)?.orbitImpactParameter;
      const bs = [0.1, 0.9, 1.2, 1.8, 3, ...(bo ? [bo * 0.999, bo * 1.001] : [])];
      for (const b of bs) {
        const chi = deflectionAngle(b, E);
        expect(Math.abs(mieDeflectionAngle(b, E, 12) - chi), `χ at b=${b}, E=${E}`).toBeLessThan(1e-10 * Math.max(1, Math.abs(chi)));
      }
    }
    for (const E of [0.3, 1, 5]) {
      const a = mieTransportCrossSections(E, 12);
      const b = transportCrossSections(E);
      expect(rel(a.q1, b.q1)).toBeLessThan(1e-10);
      expect(rel(a.q2, b.q2)).toBeLessThan(1e-10);
    }
  });
});

describe('Mie λr-6 collision integrals: the method', () => {
  it('orbiting threshold: 0.8 at λr = 12 (closed form), and the numerical maximum of u* + r u*′/2 at other λr within 1e-9', () => {
    expect(mieOrbitingEnergy(12)).toBeCloseTo(0.8, 14);
    const o = mieOrbitingParameters(0.5, 12)!;
    const ref = orbitingParameters(0.5)!;
    expect(rel(o.orbitRadius, ref.orbitRadius)).toBeLessThan(1e-12);
    expect(rel(o.orbitImpactParameter, ref.orbitImpactParameter)).toBeLessThan(1e-12);
    for (const n of [8, 10, 16, 23.5, 36]) {
      const c = miePrefactor(n);
      // Golden-section maximum of E(r) = u*(r) + r u*′(r)/2 beyond the potential minimum (independent of the closed form).
      const energy = (r: number) => c * ((1 - n / 2) * Math.pow(r, -n) + 2 * Math.pow(r, -6));
      let [a, b] = [1, 3];
      for (let i = 0; i < 200; i++) {
        const m1 = b - 0.618 * (b - a);
        const m2 = a + 0.618 * (b - a);
        if (energy(m1) > energy(m2)) b = m2;
        else a = m1;
      }
      expect(rel(mieOrbitingEnergy(n), energy((a + b) / 2)), `E_o at λr=${n}`).toBeLessThan(1e-9);
    }
  });

  it('the interpolated table agrees with the definition (thermal average by adaptive quadrature) off the λr grid within 2e-6', () => {
    // λr = 17 lies between grid columns 16 and 18, T* = 5 between T* nodes: both interpolations are exercised.
    const exact = mieCollisionIntegralsExact(5, 17);
    const table = mieCollisionIntegrals(5, 17);
    expect(rel(table.omega11, exact.omega11)).toBeLessThan(2e-6);
    expect(rel(table.omega22, exact.omega22)).toBeLessThan(2e-6);
    expect(Math.abs(table.dOmega22dT - exact.dOmega22dT)).toBeLessThan(1e-4 * Math.abs(exact.dOmega22dT));
  });

  it('the interpolated table agrees within 2e-6 with values computed by the definition at points off both grids', () => {
    // Computed on 2026-12-02 with mieCollisionIntegralsExact (default tolerances, adaptive thermal average, 20–140 s each):
    // a check of the table and its interpolation against this file's own definition, not of the method. [λr, T*, Ω11, Ω22]
    const EXACT: Array<[number, number, number, number]> = [
      [9.5, 0.5, 2.2072904407343663, 2.451544190530601],
      [13.5, 0.3, 2.541990132182425, 2.7284598878088766],
      [16, 2, 1.08307613763178, 1.171713796463898],
      [21, 20, 0.7665480462941319, 0.8274616265651772],
      [30, 1.5, 1.1864421086540249, 1.265661657005786],
    ];
    for (const [n, t, o11, o22] of EXACT) {
      const m = mieCollisionIntegrals(t, n);
      expect(rel(m.omega11, o11), `Ω11 at λr=${n}, T*=${t}`).toBeLessThan(2e-6);
      expect(rel(m.omega22, o22), `Ω22 at λr=${n}, T*=${t}`).toBeLessThan(2e-6);
    }
  });

  it('refuses λr outside 8–36 and T* outside the table', () => {
    expect(() => mieCollisionIntegrals(1, 40)).toThrow(/from 8 to 36, got 40/);
    expect(() => mieCollisionIntegrals(0.1, 16)).toThrow(RangeError);
    expect(() => mieCollisionIntegrals(500, 16)).toThrow(/outside the collision-integral table range/);
  });
});

describe('Mie λr-6 cross-sections against the independent scipy quadrature (validation registry, within 1e-7; observed below 1e-8)', () => {
  itPassesReferenceChecks(MIE_CROSS_SECTION_CHECKS);
});

describe('Chapman–Enskog viscosity of a Mie λr-6 gas', () => {
  it('gives the analytic ∂η/∂ε and ∂η/∂σ of the interpolant (central differences within 1e-6), with and without Kihara', () => {
    for (const correction of ['none', 'kihara'] as const) {
      for (const [T, n] of [
        [300, 16],
        [180, 9.5],
        [900, 30],
      ] as Array<[number, number]>) {
        const at = (e: number, s: number) =>
          viscosityWithGradient(T, e, s, 58.1, { repulsiveExponent: n, higherOrderCorrection: correction }).viscosityMicroPaS;
        const p = viscosityWithGradient(T, 150, 3.7, 58.1, { repulsiveExponent: n, higherOrderCorrection: correction });
        const he = 1e-4;
        const hs = 1e-6;
        expect(
          rel(p.dEtadEpsilonK, (at(150 + he, 3.7) - at(150 - he, 3.7)) / (2 * he)),
          `∂η/∂ε at ${T} K, λr=${n}, ${correction}`,
        ).toBeLessThan(1e-6);
        expect(rel(p.dEtadSigmaAngstrom, (at(150, 3.7 + hs) - at(150, 3.7 - hs)) / (2 * hs))).toBeLessThan(1e-6);
      }
    }
  });

  it('a harder repulsion means a larger high-energy collision diameter: Ω(2,2)* at T* = 20 rises with λr (common practice, no source)', () => {
    const values = [8, 10, 12, 16, 20, 28, 36].map((n) => mieCollisionIntegrals(20, n).omega22);
    for (let i = 1; i < values.length; i++) expect(values[i]).toBeGreaterThan(values[i - 1]);
  });
});
