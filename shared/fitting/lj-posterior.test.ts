import { describe, expect, it } from 'vitest';
import { b2WithGradient } from '../physics/virial';
import { fitLennardJones, type FitMeasurementSet } from './lj-fit';
import { chi2Function, ljPosterior, posteriorPredictiveBand } from './lj-posterior';
import { gaussianGenerator, mulberry32 } from './random';

// Synthetic B2 tables from the exact quadrature (virial.ts) at a known truth, with Gaussian noise of the stated size.
const TRUTH = { epsilonK: 150, sigmaAngstrom: 3.7 };
function table(temperatures: number[], u: (b2: number) => number, gauss: () => number, truth = TRUTH): FitMeasurementSet {
  return {
    id: 'synthetic',
    kind: 'b2',
    rows: temperatures.map((temperatureK) => {
      const exact = b2WithGradient(temperatureK, truth.epsilonK, truth.sigmaAngstrom).b2Cm3PerMol;
      const uncertainty = u(exact);
      return { temperatureK, value: exact + uncertainty * gauss(), uncertainty };
    }),
  };
}
const FIT = { restarts: 0, profiles: false } as const;

describe('posterior of LJ parameters from B2', () => {
  it('coverage: the 95 % intervals contain the truth in 95 % ± 3 binomial standard deviations of 120 synthetic tables', () => {
    // 120 tables: the binomial standard deviation of the hit rate is √(0.95·0.05/120) = 0.020, so 0.95 ± 0.060
    // (the test fails by chance about 3 times in 1000 for a correct sampler; the seeds are fixed, so it is deterministic).
    const gauss = gaussianGenerator(mulberry32(2026));
    const n = 120;
    let hitsEps = 0;
    let hitsSigma = 0;
    for (let i = 0; i < n; i++) {
      const data = [table([110, 130, 160, 200, 260, 350, 480, 650], (b) => 1.5 + 0.02 * Math.abs(b), gauss)];
      const fit = fitLennardJones(data, FIT);
      const post = ljPosterior(data, {}, fit, { noise: 'stated', samples: 200, burnIn: 100, walkers: 16, seed: 100 + i, drawsReturned: 0 });
      if (post.epsilonK.lower95 <= TRUTH.epsilonK && TRUTH.epsilonK <= post.epsilonK.upper95) hitsEps++;
      if (post.sigmaAngstrom.lower95 <= TRUTH.sigmaAngstrom && TRUTH.sigmaAngstrom <= post.sigmaAngstrom.upper95) hitsSigma++;
    }
    const tolerance = 3 * Math.sqrt((0.95 * 0.05) / n);
    expect(Math.abs(hitsEps / n - 0.95)).toBeLessThan(tolerance);
    expect(Math.abs(hitsSigma / n - 0.95)).toBeLessThan(tolerance);
  });

  it('a well-conditioned table: posterior and linearised 95 % intervals agree within 4 % of the half-width, and no disagreement is reported', () => {
    const gauss = gaussianGenerator(mulberry32(5));
    const temps = Array.from({ length: 16 }, (_, i) => 100 + i * 50);
    const data = [table(temps, () => 0.05, gauss)];
    const fit = fitLennardJones(data, FIT);
    const post = ljPosterior(data, {}, fit, { samples: 2500, burnIn: 300, walkers: 24, seed: 9 });
    for (const name of ['epsilonK', 'sigmaAngstrom'] as const) {
      const lin = post.linearised[name]!;
      const half = (lin.upper95 - lin.lower95) / 2;
      expect(Math.abs(post[name].lower95 - lin.lower95) / half).toBeLessThan(0.04);
      expect(Math.abs(post[name].upper95 - lin.upper95) / half).toBeLessThan(0.04);
    }
    expect(post.messages.filter((m) => m.includes('differs from the linearised'))).toEqual([]);
    expect(post.diagnostics.converged).toBe(true);
    expect(Math.abs((post.correlation as number) - (fit.correlation as number))).toBeLessThan(0.01);
  });

  it('a poorly constrained table (three high-temperature points): the posterior is lopsided and the result says so in plain words', () => {
    const gauss = gaussianGenerator(mulberry32(8));
    const data = [table([400, 600, 900], (b) => 4 + 0.05 * Math.abs(b), gauss)];
    const fit = fitLennardJones(data, FIT);
    const post = ljPosterior(data, {}, fit, { noise: 'stated', samples: 1500, burnIn: 500, seed: 3 });
    expect(post.messages.some((m) => /differs from the linearised one/.test(m))).toBe(true);
  });

  it('is reproducible to the last digit with the same seed', () => {
    const gauss = gaussianGenerator(mulberry32(1));
    const data = [table([120, 180, 260, 400], () => 2, gauss)];
    const fit = fitLennardJones(data, FIT);
    const a = ljPosterior(data, {}, fit, { samples: 100, burnIn: 50, seed: 4 });
    const b = ljPosterior(data, {}, fit, { samples: 100, burnIn: 50, seed: 4 });
    expect(b).toEqual(a);
  });

  it("the χ² it samples is the fit's χ² at the optimum", () => {
    const gauss = gaussianGenerator(mulberry32(2));
    const data = [table([120, 180, 260, 400, 700], () => 2, gauss)];
    const fit = fitLennardJones(data, FIT);
    expect(chi2Function(data, {})(fit.epsilonK, fit.sigmaAngstrom) / fit.chi2).toBeCloseTo(1, 8);
  });

  it('posterior-predictive band brackets the model at the median parameters', () => {
    const gauss = gaussianGenerator(mulberry32(3));
    const data = [table([120, 180, 260, 400, 700], () => 2, gauss)];
    const fit = fitLennardJones(data, FIT);
    const post = ljPosterior(data, {}, fit, { samples: 300, burnIn: 100, seed: 5, drawsReturned: 300 });
    const band = posteriorPredictiveBand('b2', [{ temperatureK: 150 }, { temperatureK: 500 }], post.draws, { quantumCorrection: false });
    band.forEach((b, i) => {
      const atFit = b2WithGradient([150, 500][i], fit.epsilonK, fit.sigmaAngstrom).b2Cm3PerMol;
      expect(b.lower95).toBeLessThan(atFit);
      expect(b.upper95).toBeGreaterThan(atFit);
    });
  });
});
