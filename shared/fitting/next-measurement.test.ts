import { describe, expect, it } from 'vitest';
import { b2WithGradient } from '../physics/virial';
import { covarianceFromJacobian } from './covariance';
import { fitLennardJones, type FitMeasurementSet } from './lj-fit';
import { rankNextMeasurements } from './next-measurement';
import { gaussianGenerator, mulberry32 } from './random';

const TRUTH = { epsilonK: 150, sigmaAngstrom: 3.7 };
function b2Table(temperatures: number[], seed: number): FitMeasurementSet {
  const g = gaussianGenerator(mulberry32(seed));
  return {
    id: 'b2-high-t',
    kind: 'b2',
    rows: temperatures.map((temperatureK) => {
      const exact = b2WithGradient(temperatureK, TRUTH.epsilonK, TRUTH.sigmaAngstrom).b2Cm3PerMol;
      return { temperatureK, value: exact + 1 * g(), uncertainty: 1 };
    }),
  };
}

describe('the next measurement to make (D-optimal)', () => {
  // B2 only well above the Boyle temperature (T* 3.3–6.7): ε is poorly fixed there, because B2 flattens out at high T*
  // and its curvature with T is what carries ε (Hirschfelder, Curtiss & Bird 1954, §3.6; common practice).
  const data = [b2Table([500, 600, 700, 800, 900, 1000], 1)];
  const fit = fitLennardJones(data, { restarts: 0, profiles: false });

  it('with B2 only at high temperature, the top suggestion is a B2 below the lowest measured temperature', () => {
    const ranked = rankNextMeasurements(fit, data, { quantumCorrection: false }, { kinds: ['b2'] });
    expect(ranked[0].kind).toBe('b2');
    // u = 1 cm³/mol at every row says nothing about the relative part, so the default 2 % applies; the best point is
    // still well below the lowest measured 500 K (T* < 2).
    expect(ranked[0].temperatureK).toBeLessThan(300);
    expect(ranked[0].areaDecreasePercent).toBeGreaterThan(50);
    expect(ranked[0].text).toMatch(
      /^B2 at [\d.]+ K \(expected -?[\d.]+ ± [\d.]+ cm3\/mol\) would make the joint 95 % region \d+ % smaller\.$/,
    );
    // Ranked best first, and a point inside the measured range helps far less.
    for (let i = 1; i < ranked.length; i++) expect(ranked[i].determinantRatio).toBeGreaterThanOrEqual(ranked[i - 1].determinantRatio);
    const [inside] = rankNextMeasurements(fit, data, { quantumCorrection: false }, { candidates: [{ kind: 'b2', temperatureK: 750 }] });
    expect(inside.areaDecreasePercent).toBeLessThan(ranked[0].areaDecreasePercent / 3);
  });

  it('the determinant ratio equals the one from recomputing (JᵀWJ)⁻¹ with the point added', () => {
    const [s] = rankNextMeasurements(fit, data, { quantumCorrection: false }, { candidates: [{ kind: 'b2', temperatureK: 160 }] });
    const rows = data[0].rows.map((r) => {
      const p = b2WithGradient(r.temperatureK, fit.epsilonK, fit.sigmaAngstrom);
      return [p.dB2dEpsilonK / r.uncertainty, p.dB2dSigmaAngstrom / r.uncertainty];
    });
    const p = b2WithGradient(160, fit.epsilonK, fit.sigmaAngstrom);
    const det = (m: number[][]) => m[0][0] * m[1][1] - m[0][1] * m[1][0];
    const before = covarianceFromJacobian(rows, 1, 1).unscaled!;
    const after = covarianceFromJacobian(
      [...rows, [p.dB2dEpsilonK / s.typicalUncertainty, p.dB2dSigmaAngstrom / s.typicalUncertainty]],
      1,
      1,
    ).unscaled!;
    expect(s.determinantRatio / (det(after) / det(before))).toBeCloseTo(1, 6);
  });

  it("offers viscosity candidates when the molar mass is known, and takes the typical uncertainty from the fit's own data", () => {
    const ranked = rankNextMeasurements(fit, data, { molarMassGPerMol: 58.1, quantumCorrection: false }, { top: 200 });
    expect(ranked.some((s) => s.kind === 'viscosity')).toBe(true);
    // The B2 table states u = 1 cm³/mol everywhere, so a new B2 is assumed no better than that.
    expect(ranked.filter((s) => s.kind === 'b2').every((s) => s.typicalUncertainty >= 1)).toBe(true);
  });
});
