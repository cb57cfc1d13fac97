import { describe, expect, it } from 'vitest';
import { b2ZeroCm3PerMol, reducedB2 } from '../physics/virial';
import { crossB2, crossParameters, fitCrossInteraction, type B12Row } from './cross-virial';

// Invented pure sets (Quillmoor-style numbers), with standard errors and ε–σ correlation as an approved set carries them.
const A = { epsilonK: 152.4, sigmaAngstrom: 3.71, stdErr: { epsilonK: 0.8, sigmaAngstrom: 0.006 }, correlation: -0.9 };
const B = { epsilonK: 231.0, sigmaAngstrom: 4.32, stdErr: { epsilonK: 1.2, sigmaAngstrom: 0.009 }, correlation: -0.92 };

describe('cross second virial coefficient', () => {
  it('obeys the corresponding-states identity B12/b0(σ12) at T*12 = the pure reduced B2', () => {
    // Exact by construction of the LJ cross potential (Hirschfelder, Curtiss & Bird 1954, §3.7, from memory).
    for (const [k, l] of [
      [0, 0],
      [0.04, 0],
      [0.05, 0.02],
    ]) {
      const { epsilon12K, sigma12Angstrom } = crossParameters(A, B, k, l);
      for (const tStar of [0.9, 1.7, 4]) {
        const b12 = crossB2(tStar * epsilon12K, A, B, k, l);
        expect(b12 / b2ZeroCm3PerMol(sigma12Angstrom)).toBeCloseTo(reducedB2(tStar), 10);
      }
    }
  });

  it('uses the Lorentz–Berthelot values at k = l = 0', () => {
    const p = crossParameters(A, B, 0, 0);
    expect(p.epsilon12K).toBeCloseTo(Math.sqrt(152.4 * 231.0), 12);
    expect(p.sigma12Angstrom).toBeCloseTo((3.71 + 4.32) / 2, 12);
  });

  it('recovers k_ij from synthetic B12 (round trip) and propagates the pure sets’ errors', () => {
    const kTrue = 0.035;
    const rows: B12Row[] = [200, 240, 280, 330, 400, 500].map((t) => ({
      temperatureK: t,
      b12Cm3PerMol: crossB2(t, A, B, kTrue),
      uB12Cm3PerMol: 2,
    }));
    const r = fitCrossInteraction(A, B, rows);
    expect(r.converged).toBe(true);
    expect(r.kij).toBeCloseTo(kTrue, 8);
    expect(r.chi2).toBeLessThan(1e-12);
    expect(r.chi2CombiningRule).toBeGreaterThan(10);
    // Exact data leave only the pure sets' part of the error; check it against a brute-force propagation:
    // shift each pure parameter by its standard error, refit, and combine (uncorrelated part only when ρ = 0).
    const bare = { ...A, correlation: 0 };
    const bareB = { ...B, correlation: 0 };
    const base = fitCrossInteraction(bare, bareB, rows);
    let variance = 0;
    for (const [which, field] of [
      [0, 'epsilonK'],
      [0, 'sigmaAngstrom'],
      [1, 'epsilonK'],
      [1, 'sigmaAngstrom'],
    ] as const) {
      const src = which === 0 ? bare : bareB;
      const h = src.stdErr[field];
      const shifted = { ...src, [field]: src[field] + h };
      const refit = which === 0 ? fitCrossInteraction(shifted, bareB, rows) : fitCrossInteraction(bare, shifted, rows);
      variance += (refit.kij - base.kij) ** 2;
    }
    expect(base.kijStdErrPure!).toBeCloseTo(Math.sqrt(variance), 4);
    expect(r.kijStdErr!).toBeGreaterThan(0);
    expect(r.epsilon12K).toBeCloseTo((1 - kTrue) * Math.sqrt(152.4 * 231), 6);
  });

  it('fits l_ij too when asked', () => {
    const rows: B12Row[] = [180, 220, 260, 320, 400, 520, 700].map((t) => ({
      temperatureK: t,
      b12Cm3PerMol: crossB2(t, A, B, 0.03, 0.015),
      uB12Cm3PerMol: 0.5,
    }));
    const r = fitCrossInteraction(A, B, rows, { fitLij: true });
    expect(r.kij).toBeCloseTo(0.03, 6);
    expect(r.lij).toBeCloseTo(0.015, 6);
  });

  it('refuses bad rows, naming the row', () => {
    expect(() => fitCrossInteraction(A, B, [{ temperatureK: 300, b12Cm3PerMol: -100, uB12Cm3PerMol: 0 }])).toThrow(/B12 row 1/);
  });
});
