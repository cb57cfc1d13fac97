import { describe, expect, it } from 'vitest';
import { omega22, omega22Derivative } from './collision-integrals';
import { VISCOSITY_HIGHER_ORDER_CORRECTION, VISCOSITY_MODEL_NOTE, kiharaViscosityFactor, viscosityWithGradient } from './viscosity';

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

// Kim & Monroe, J. Comput. Phys. 273, 358 (2014) correlations (±0.007 % of their exact values, 0.3 ≤ T* ≤ 400):
// Ω(l,s)* = A + Σ_{k=1..6} [B_k/T*^k + C_k (ln T*)^k]; coefficients transcribed from the paper's table as
// reproduced in the open-source `chemicals` Python library.
const KM = {
  omega22: {
    a: -0.92032979,
    b: [2.3508044, 0.50110649, -0.47193769, 0.15806367, -0.026367184, 0.0018120118],
    c: [1.6330213, -0.69795156, 0.16096572, -0.02210944, 0.0017031434, -0.000056699986],
  },
  omega23: {
    a: 2.5955799,
    b: [-1.8569443, 0.96985775, -0.39888526, 0.090063692, -0.010918991, 0.00056646797],
    c: [-1.4586197, 0.52947262, -0.11946363, 0.016264589, -0.0012354315, 0.000040366357],
  },
};
function km(kind: keyof typeof KM, t: number): number {
  const { a, b, c } = KM[kind];
  let v = a;
  for (let k = 1; k <= 6; k++) v += b[k - 1] / t ** k + c[k - 1] * Math.log(t) ** k;
  return v;
}

describe("optional Kihara second approximation f_η = 1 + (3/196)(8E* − 7)²", () => {
  it('Ω(2,3)* = Ω(2,2)* + (T*/4) dΩ(2,2)*/dT* from the table matches Kim & Monroe (2014) Ω(2,3)* within 0.02 % for 0.5 ≤ T* ≤ 200', () => {
    for (let t = 0.5; t <= 200; t *= 1.4) {
      const omega23 = omega22(t) + (t / 4) * omega22Derivative(t);
      expect(rel(omega23, km('omega23', t)), `T*=${t}`).toBeLessThan(2e-4);
    }
  });

  it('f_η agrees with the factor built from the Kim & Monroe (2014) Ω(2,3)*/Ω(2,2)* within 5e-5, and stays in [1, 1.01] for T* ≤ 100', () => {
    for (let t = 0.5; t <= 100; t *= 1.5) {
      const e = km('omega23', t) / km('omega22', t);
      const reference = 1 + (3 / 196) * (8 * e - 7) ** 2;
      const f = kiharaViscosityFactor(t).factor;
      expect(Math.abs(f - reference), `T*=${t}`).toBeLessThan(5e-5);
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
