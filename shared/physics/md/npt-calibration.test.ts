import { describe, expect, it } from 'vitest';
import { runNpt } from './npt';
import { STATISTICS_CHECKS } from '../../validation/checks/statistics-checks';
import { itPassesReferenceChecks } from '../../validation/reference-check-tests';

/**
 * Are the reported standard errors honest? At two fluid states, 20 independent runs (seeds 1–20) each report ρ* with
 * a standard error. If the errors are right, (n − 1)·s²/⟨SE²⟩ follows the χ² distribution with n − 1 = 19 degrees of
 * freedom (s² the sample variance of ρ* over the seeds, ⟨SE²⟩ the mean reported variance; common practice, no source),
 * so s²/⟨SE²⟩ lies in [χ²₁₉(0.005), χ²₁₉(0.995)]/19 = [6.844, 38.582]/19 = [0.360, 2.031] in 99 % of such tests.
 * Before the window estimator the ratio was about 4.8 at T* = 1.5, P* = 0.5 (errors 2.2× too small).
 * Runs: 128 atoms, 5000 steps extended up to 20 000 towards 50 effective samples (at most 2.6 M atom-steps each).
 * The states are the two the under-reporting was found at (T* = 1.5, P* = 0.5 and T* = 1.2, P* = 1.0).
 */
const SEEDS = Array.from({ length: 20 }, (_, i) => i + 1);
const DOF = SEEDS.length - 1;
const BAND = [6.844, 38.582];

describe('calibration of the reported standard errors', () => {
  // The 99 % band of χ² with 19 degrees of freedom: quantiles from the regularised incomplete gamma function
  // (shared/fitting/statistics.ts) against the tabulated χ²₁₉(0.005) = 6.844 and χ²₁₉(0.995) = 38.582 (NIST/SEMATECH
  // e-Handbook, table 1.3.6.7.4, from memory): registry entries statistics.chi2-19.*, whose references are the band.
  const bandChecks = STATISTICS_CHECKS.filter((c) => c.id.startsWith('statistics.chi2-19.'));
  itPassesReferenceChecks(bandChecks);
  it('takes its band from those checks', () => {
    expect(bandChecks.map((c) => c.reference)).toEqual(BAND);
    expect(bandChecks.every((c) => c.degreesOfFreedom[0] === DOF)).toBe(true);
  });

  for (const [t, p] of [
    [1.5, 0.5],
    [1.2, 1.0],
  ] as const) {
    it(`T* = ${t}, P* = ${p}: variance over 20 seeds / mean reported variance inside the band`, () => {
      const runs = SEEDS.map((seed) => runNpt({ reducedTemperature: t, reducedPressure: p, atoms: 128, steps: 5000, seed }));
      for (const r of runs) expect(r.phase).toBe('fluid');
      const ratio = (values: number[], errors: number[]) => {
        const m = values.reduce((a, b) => a + b, 0) / values.length;
        const s2 = values.reduce((a, b) => a + (b - m) ** 2, 0) / (values.length - 1);
        return s2 / (errors.reduce((a, b) => a + b * b, 0) / errors.length);
      };
      const density = ratio(
        runs.map((r) => r.reducedDensity),
        runs.map((r) => r.stdErr),
      );
      expect(density * DOF).toBeGreaterThan(BAND[0]);
      expect(density * DOF).toBeLessThan(BAND[1]);
      // The fluctuation derivative (∂ρ*/∂P*)_T carries its own error bar, calibrated the same way.
      const slope = ratio(
        runs.map((r) => r.dRhoDP),
        runs.map((r) => r.dRhoDPStdErr),
      );
      expect(slope * DOF).toBeGreaterThan(BAND[0]);
      expect(slope * DOF).toBeLessThan(BAND[1]);
    }, 600_000);
  }
});
