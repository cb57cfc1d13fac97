import { describe, expect, it } from 'vitest';
import { factorial, gamma } from 'mathjs';
import {
  b2WithGradient,
  b2ZeroCm3PerMol,
  boyleReducedTemperature,
  deBoerParameterSquared,
  reducedB2,
  reducedB2Derivative,
  reducedQuantumB2Coefficient,
} from './virial';

// Exact series for the LJ 12-6 reduced second virial coefficient (Hirschfelder, Curtiss & Bird 1954,
// eq. 3.6-9): B2* = −Σ_j (2^{j+1/2}/(4 j!)) Γ((2j−1)/4) T*^{−(2j+1)/4}, with Γ from mathjs as the
// reference library. Returns the series and its term-by-term T*-derivative.
function hcbSeries(tStar: number): { b2: number; db2: number } {
  let b2 = 0;
  let db2 = 0;
  for (let j = 0; j < 160; j++) {
    const p = (2 * j + 1) / 4;
    const coeff = (Math.pow(2, j + 0.5) / (4 * Number(factorial(j)))) * Number(gamma((2 * j - 1) / 4));
    const term = -coeff * Math.pow(tStar, -p);
    b2 += term;
    db2 += -p * (term / tStar);
    if (j > 10 && Math.abs(term) < 1e-18 * Math.abs(b2) && Math.abs(term) < 1e-18) break;
  }
  return { b2, db2 };
}

// Independent series for B_I*(T*) = (1/(16π²T*³)) ∫ e^{−u*/T*} (du*/dx)² x² dx: expanding e^{4x^−6/T*}
// and integrating each power against e^{−4x^−12/T*} gives ∫_0^∞ x^−q e^{−a x^−12} dx = a^{−(q−1)/12} Γ((q−1)/12)/12
// (derived here from the definition; Γ from mathjs). (du*/dx)² x² = 576 (x^−12 − 4x^−18 + 4x^−24).
function quantumSeries(tStar: number): number {
  const a = 4 / tStar;
  const moment = (q: number) => (Math.pow(a, -(q - 1) / 12) * Number(gamma((q - 1) / 12))) / 12;
  let sum = 0;
  for (let k = 0; k < 150; k++) {
    const pref = Math.pow(a, k) / Number(factorial(k));
    const term = 576 * pref * (moment(12 + 6 * k) - 4 * moment(18 + 6 * k) + 4 * moment(24 + 6 * k));
    sum += term;
    if (k > 10 && Math.abs(term) < 1e-18 * Math.abs(sum)) break;
  }
  return sum / (16 * Math.PI * Math.PI * tStar ** 3);
}

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('reduced B2* by quadrature', () => {
  it('matches the Hirschfelder–Curtiss–Bird (1954) exact series to 1e-9 relative over 0.5 ≤ T* ≤ 100', () => {
    for (const t of [0.5, 0.7, 1, 1.5, 2, 2.5, 3, 4, 5, 7, 10, 20, 30, 50, 100]) {
      const ref = hcbSeries(t).b2;
      expect(rel(reducedB2(t), ref), `T*=${t}`).toBeLessThan(1e-9);
    }
  });

  it('holds 1e-9 near the Boyle point in absolute terms (B2* ≈ 0 there, so relative error is meaningless)', () => {
    for (const t of [3.3, 3.418, 3.5]) expect(Math.abs(reducedB2(t) - hcbSeries(t).b2)).toBeLessThan(1e-11);
  });

  it('matches the series at the ends of the fitting range T* = 0.3 and 1000', () => {
    expect(rel(reducedB2(0.3), hcbSeries(0.3).b2)).toBeLessThan(1e-9);
    expect(rel(reducedB2(1000), hcbSeries(1000).b2)).toBeLessThan(1e-9);
  });

  it('agrees with tabulated values of Hirschfelder et al. 1954 Table I-B (from memory: B*(1) = −2.538, B*(0.3) = −27.88)', () => {
    expect(reducedB2(1)).toBeCloseTo(-2.538, 3);
    expect(reducedB2(0.3)).toBeCloseTo(-27.88, 2);
  });

  it('dB2*/dT* matches the term-by-term derivative of the series to 1e-9 relative', () => {
    for (const t of [0.3, 0.5, 1, 2, 3.418, 10, 25, 100]) {
      expect(rel(reducedB2Derivative(t), hcbSeries(t).db2), `T*=${t}`).toBeLessThan(1e-9);
    }
  });

  it('dB2*/dT* changes sign at the temperature of the maximum of B2* (T* ≈ 25, Hirschfelder et al. 1954, from memory)', () => {
    expect(reducedB2Derivative(20)).toBeGreaterThan(0);
    expect(reducedB2Derivative(30)).toBeLessThan(0);
  });

  it('Boyle temperature T*_B ≈ 3.418 (Hirschfelder et al. 1954) and B2*(T*_B) = 0 by the series', () => {
    const tb = boyleReducedTemperature();
    expect(tb).toBeCloseTo(3.418, 3);
    expect(Math.abs(hcbSeries(tb).b2)).toBeLessThan(1e-11);
  });

  it('rejects bad reduced temperatures with a RangeError naming tStar', () => {
    expect(() => reducedB2(0)).toThrow(/tStar/);
    expect(() => reducedB2(Number.NaN)).toThrow(RangeError);
    expect(() => reducedB2Derivative(-1)).toThrow(/tStar/);
    expect(() => reducedB2(1e-3)).toThrow(/range/);
  });
});

describe('b0 and dimensional B2', () => {
  it('b0 = 2πN_Aσ³/3 (N_A from CODATA 2018, Tiesinga et al. 2021): 1.2612742 σ³ cm³/mol', () => {
    // (2π/3)·6.02214076e23·1e-24 = 2.0943951024·0.602214076 = 1.26127421… cm³/mol per Å³ (hand computation, exact N_A).
    expect(b2ZeroCm3PerMol(1)).toBeCloseTo(1.26127421, 7);
    expect(rel(b2ZeroCm3PerMol(3.405), 1.26127421 * 3.405 ** 3)).toBeLessThan(1e-8);
    expect(() => b2ZeroCm3PerMol(0)).toThrow(/sigmaAngstrom/);
  });

  it('argon with ε/k = 119.8 K, σ = 3.405 Å at 273.15 K gives B2 ≈ −21 cm³/mol (Hirschfelder et al. 1954 Table; measured −21.5, from memory)', () => {
    const p = b2WithGradient(273.15, 119.8, 3.405);
    expect(p.b2Cm3PerMol).toBeGreaterThan(-23);
    expect(p.b2Cm3PerMol).toBeLessThan(-19);
    expect(p.quantumCorrectionCm3PerMol).toBe(0);
  });

  it('classical gradient matches central finite differences, and ∂B2/∂σ = 3B2/σ', () => {
    const [T, e, s] = [250, 150, 3.6];
    const p = b2WithGradient(T, e, s);
    const h = 1e-4;
    const fdE = (b2WithGradient(T, e * (1 + h), s).b2Cm3PerMol - b2WithGradient(T, e * (1 - h), s).b2Cm3PerMol) / (2 * e * h);
    const fdS = (b2WithGradient(T, e, s * (1 + h)).b2Cm3PerMol - b2WithGradient(T, e, s * (1 - h)).b2Cm3PerMol) / (2 * s * h);
    expect(rel(p.dB2dEpsilonK, fdE)).toBeLessThan(1e-6);
    expect(rel(p.dB2dSigmaAngstrom, fdS)).toBeLessThan(1e-6);
    expect(rel(p.dB2dSigmaAngstrom, (3 * p.b2Cm3PerMol) / s)).toBeLessThan(1e-12);
  });

  it('validates every input with a RangeError naming the parameter', () => {
    expect(() => b2WithGradient(-1, 100, 3)).toThrow(/temperatureK/);
    expect(() => b2WithGradient(300, Number.POSITIVE_INFINITY, 3)).toThrow(/epsilonK/);
    expect(() => b2WithGradient(300, 100, 0)).toThrow(/sigmaAngstrom/);
    expect(() => b2WithGradient(300, 100, 3, { molarMassGPerMol: 0 })).toThrow(/molarMassGPerMol/);
  });
});

describe('first-order quantum (Wigner–Kirkwood) correction', () => {
  it('reduced de Boer parameter Λ* of helium (ε/k = 10.22 K, σ = 2.556 Å, M = 4.0026) ≈ 2.67 (de Boer 1948; Hirschfelder et al. 1954 Table 6.4-1, from memory)', () => {
    expect(Math.abs(Math.sqrt(deBoerParameterSquared(10.22, 2.556, 4.0026)) - 2.67)).toBeLessThan(0.01);
    // neon (ε/k = 35.6 K, σ = 2.749 Å, M = 20.18): Λ* ≈ 0.59 (same sources, from memory)
    expect(Math.abs(Math.sqrt(deBoerParameterSquared(35.6, 2.749, 20.18)) - 0.59)).toBeLessThan(0.01);
  });

  it('B_I*(T*) matches an independent Gamma-function series (no published table at hand: independent check) to 1e-9', () => {
    for (const t of [0.5, 1, 2.5, 10, 100]) expect(rel(reducedQuantumB2Coefficient(t), quantumSeries(t)), `T*=${t}`).toBeLessThan(1e-9);
  });

  it('is positive (quantum effects raise B2 of light gases) and adds to the classical value', () => {
    const classical = b2WithGradient(50, 10.22, 2.556);
    const q = b2WithGradient(50, 10.22, 2.556, { molarMassGPerMol: 4.0026 });
    expect(q.quantumCorrectionCm3PerMol).toBeGreaterThan(0);
    expect(q.b2Cm3PerMol).toBeCloseTo(classical.b2Cm3PerMol + q.quantumCorrectionCm3PerMol, 12);
  });

  it('gradient with the quantum term matches central finite differences; ∂B2/∂σ is no longer 3B2/σ', () => {
    const [T, e, s, M] = [40, 10.22, 2.556, 4.0026];
    const f = (ee: number, ss: number) => b2WithGradient(T, ee, ss, { molarMassGPerMol: M }).b2Cm3PerMol;
    const p = b2WithGradient(T, e, s, { molarMassGPerMol: M });
    const h = 1e-4;
    const fdE = (f(e * (1 + h), s) - f(e * (1 - h), s)) / (2 * e * h);
    const fdS = (f(e, s * (1 + h)) - f(e, s * (1 - h))) / (2 * s * h);
    expect(rel(p.dB2dEpsilonK, fdE)).toBeLessThan(1e-6);
    expect(rel(p.dB2dSigmaAngstrom, fdS)).toBeLessThan(1e-6);
    expect(rel(p.dB2dSigmaAngstrom, (3 * p.b2Cm3PerMol) / s)).toBeGreaterThan(1e-3);
  });
});
