import { describe, expect, it } from 'vitest';
import { omega22 } from './collision-integrals';
import { VISCOSITY_HIGHER_ORDER_CORRECTION, VISCOSITY_MODEL_NOTE, viscosityWithGradient } from './viscosity';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('Chapman–Enskog dilute-gas viscosity (first approximation)', () => {
  it('reproduces the handbook form μ = 2.6693e−5 √(MT)/(σ²Ω) g/(cm·s) (Bird, Stewart & Lightfoot, Transport Phenomena, 2nd ed. 2002, eq. 1.4-14; from memory)', () => {
    // 1 g/(cm·s) = 1e5 µPa·s. The handbook constant was evaluated with pre-2019 constants; 0.02 % covers that.
    for (const [T, e, s, M] of [
      [300, 190, 3.996, 44.01], // CO2 parameters of BSL Example 1.4-1 (from memory)
      [500, 122.4, 3.432, 39.948],
      [80, 71.4, 3.798, 28.0134],
    ]) {
      const handbook = (2.6693e-5 * Math.sqrt(M * T)) / (s * s * omega22(T / e)) * 1e5;
      expect(rel(viscosityWithGradient(T, e, s, M).viscosityMicroPaS, handbook)).toBeLessThan(2e-4);
    }
  });

  it('equals the dilute-gas term of Lemmon & Jacobsen (Int. J. Thermophys. 25, 21, 2004): η0 = 0.0266958 √(MT)/(σ²Ω) µPa·s, σ in nm', () => {
    // Same Chapman–Enskog expression with the constant evaluated by the authors (quoted on the ASCEND FPROPS viscosity page).
    for (const [T, e, s, M] of [
      [300, 122.4, 3.432, 39.948],
      [1000, 98.94, 3.656, 28.013],
    ]) {
      const sigmaNm = s / 10;
      const lj = (0.0266958 * Math.sqrt(M * T)) / (sigmaNm * sigmaNm * omega22(T / e));
      expect(rel(viscosityWithGradient(T, e, s, M).viscosityMicroPaS, lj)).toBeLessThan(1e-5);
    }
  });

  it('CO2 at 300 K with σ = 3.996 Å, ε/k = 190 K gives ≈ 14.9 µPa·s; measured 15.0 (BSL 2nd ed. Example 1.4-1, from memory)', () => {
    const eta = viscosityWithGradient(300, 190, 3.996, 44.01).viscosityMicroPaS;
    expect(eta).toBeGreaterThan(14.7);
    expect(eta).toBeLessThan(15.2);
  });

  it('argon at 300 K with σ = 3.432 Å, ε/k = 122.4 K (BSL 2nd ed. Table E.1, from memory) is within 2 % of the measured 22.7 µPa·s (Lemmon & Jacobsen 2004, from memory)', () => {
    const eta = viscosityWithGradient(300, 122.4, 3.432, 39.948).viscosityMicroPaS;
    expect(rel(eta, 22.7)).toBeLessThan(0.02);
  });

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
