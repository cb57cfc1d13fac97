import { describe, expect, it } from 'vitest';
import { VISCOSITY_HIGHER_ORDER_CORRECTION, VISCOSITY_MODEL_NOTE, kiharaViscosityFactor, viscosityWithGradient } from './viscosity';

import { VISCOSITY_CHECKS } from '../validation/checks/transport-checks';
import { itPassesReferenceChecks } from '../validation/reference-check-tests';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('Chapman–Enskog dilute-gas viscosity (first approximation)', () => {
  // The handbook form of Bird, Stewart & Lightfoot (2002, eq. 1.4-14; 0.02 %), the dilute-gas term of Lemmon & Jacobsen
  // (2004; 1e-5), CO2 and argon at 300 K against measured values, and the Kihara factor and Ω(2,3)* against Kim & Monroe
  // (2014): registry entries (shared/validation/checks/transport-checks.ts).
  itPassesReferenceChecks(VISCOSITY_CHECKS);

  it('analytic gradient matches central finite differences', () => {
    for (const [T, e, s, M] of [
      [300, 122.4, 3.432, 39.948],
      [60, 120, 3.4, 39.948], // T* = 0.5, steep Ω region
      [2000, 35.7, 2.789, 20.18],
    ]) {
      const p = viscosityWithGradient(T, e, s, M);
      const h = 1e-5;
      const fdE =
        (viscosityWithGradient(T, e * (1 + h), s, M).viscosityMicroPaS - viscosityWithGradient(T, e * (1 - h), s, M).viscosityMicroPaS) /
        (2 * e * h);
      const fdS =
        (viscosityWithGradient(T, e, s * (1 + h), M).viscosityMicroPaS - viscosityWithGradient(T, e, s * (1 - h), M).viscosityMicroPaS) /
        (2 * s * h);
      expect(rel(p.dEtadEpsilonK, fdE), `dη/dε at T=${T}`).toBeLessThan(1e-5);
      expect(rel(p.dEtadSigmaAngstrom, fdS), `dη/dσ at T=${T}`).toBeLessThan(1e-7);
    }
  });

  it('states that no higher-order correction is applied', () => {
    expect(VISCOSITY_HIGHER_ORDER_CORRECTION).toBe('none (first Chapman–Enskog approximation)');
    expect(VISCOSITY_MODEL_NOTE).toMatch(/first approximation/);
  });

  it('validates inputs with a RangeError naming the parameter, and refuses T* outside the table', () => {
    expect(() => viscosityWithGradient(0, 100, 3, 40)).toThrow(/temperatureK/);
    expect(() => viscosityWithGradient(300, Number.NaN, 3, 40)).toThrow(/epsilonK/);
    expect(() => viscosityWithGradient(300, 100, -3, 40)).toThrow(/sigmaAngstrom/);
    expect(() => viscosityWithGradient(300, 100, 3, 0)).toThrow(/molarMassGPerMol/);
    expect(() => viscosityWithGradient(10, 100, 3, 40)).toThrow(/reduced temperature.*range/);
  });
});

describe('optional Kihara second approximation f_η = 1 + (3/196)(8E* − 7)²', () => {
  it('f_η stays in [1, 1.01] for T* ≤ 100 (its agreement with Kim & Monroe 2014: registry entry viscosity.kihara-factor)', () => {
    for (let t = 0.5; t <= 100; t *= 1.5) {
      const f = kiharaViscosityFactor(t).factor;
      expect(f).toBeGreaterThanOrEqual(1);
      expect(f).toBeLessThan(1.01);
    }
  });

  it('applies the factor only when asked, with a gradient that matches finite differences', () => {
    const [T, e, s, M] = [1500, 120, 3.4, 39.948]; // T* = 12.5
    const plain = viscosityWithGradient(T, e, s, M);
    const corrected = viscosityWithGradient(T, e, s, M, { higherOrderCorrection: 'kihara' });
    expect(corrected.viscosityMicroPaS / plain.viscosityMicroPaS).toBeCloseTo(kiharaViscosityFactor(T / e).factor, 12);
    for (const [TT, ee] of [
      [1500, 120],
      [36, 120], // T* = 0.3, where f_η changes fastest
    ]) {
      const f = (eps: number, sig: number) => viscosityWithGradient(TT, eps, sig, M, { higherOrderCorrection: 'kihara' }).viscosityMicroPaS;
      const p = viscosityWithGradient(TT, ee, s, M, { higherOrderCorrection: 'kihara' });
      const h = 1e-5;
      expect(rel(p.dEtadEpsilonK, (f(ee * (1 + h), s) - f(ee * (1 - h), s)) / (2 * ee * h)), `T*=${TT / ee}`).toBeLessThan(1e-4);
      expect(rel(p.dEtadSigmaAngstrom, (f(ee, s * (1 + h)) - f(ee, s * (1 - h))) / (2 * s * h))).toBeLessThan(1e-7);
    }
    expect(() => viscosityWithGradient(T, e, s, M, { higherOrderCorrection: 'full' as never })).toThrow(/higherOrderCorrection/);
  });
});
