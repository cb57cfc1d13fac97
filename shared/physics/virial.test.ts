import { describe, expect, it } from 'vitest';
import { b2WithGradient, b2ZeroCm3PerMol, boyleReducedTemperature, reducedB2, reducedB2Derivative } from './virial';
import { hcbSeries } from '../validation/independent-references';
import { B2_CHECKS, QUANTUM_B2_CHECKS } from '../validation/checks/virial-checks';
import { itPassesReferenceChecks } from '../validation/reference-check-tests';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('reduced B2* by quadrature', () => {
  // Against the Hirschfelder–Curtiss–Bird (1954) exact series and Table I-B, b0, the Boyle temperature and argon at
  // 273.15 K: the registry entries (shared/validation/checks/virial-checks.ts), also run by the admin validation page.
  itPassesReferenceChecks(B2_CHECKS);

  it('dB2*/dT* changes sign at the temperature of the maximum of B2* (T* ≈ 25, Hirschfelder et al. 1954, from memory)', () => {
    expect(reducedB2Derivative(20)).toBeGreaterThan(0);
    expect(reducedB2Derivative(30)).toBeLessThan(0);
  });

  it('B2*(T*_B) = 0 by the series at the Boyle temperature found (T*_B itself: registry entry b2.boyle-temperature)', () => {
    const tb = boyleReducedTemperature();
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
  it('b0 = 2πN_Aσ³/3 scales with σ³ (b0 of σ = 1 Å against CODATA 2018: registry entry b2.b0-per-cubic-angstrom)', () => {
    // (2π/3)·6.02214076e23·1e-24 = 2.0943951024·0.602214076 = 1.26127421… cm³/mol per Å³ (hand computation, exact N_A).
    expect(rel(b2ZeroCm3PerMol(3.405), 1.26127421 * 3.405 ** 3)).toBeLessThan(1e-8);
    expect(() => b2ZeroCm3PerMol(0)).toThrow(/sigmaAngstrom/);
  });

  it('argon at 273.15 K without a molar mass has no quantum correction (its B2: registry entry b2.argon-273)', () => {
    const p = b2WithGradient(273.15, 119.8, 3.405);
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
  // Λ* of helium and neon from Λ*² (de Boer 1948; Hirschfelder et al. 1954 Table 6.4-1) and B_I*(T*) against an
  // independent Γ-function series: registry entries whose test file is this one.
  itPassesReferenceChecks(QUANTUM_B2_CHECKS.filter((c) => c.testFile === 'shared/physics/virial.test.ts'));

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
