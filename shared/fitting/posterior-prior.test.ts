import { describe, expect, it } from 'vitest';
import { b2WithGradient } from '../physics/virial';
import { densityPosterior } from './density-posterior';
import { fitLennardJones, type FitMeasurementSet } from './lj-fit';
import { ljPosterior, priorOnFree, type ParameterSetPrior } from './lj-posterior';
import { choleskyLower } from './posterior';
import { gaussianGenerator, mulberry32 } from './random';

// A synthetic B2 table from the exact quadrature (virial.ts) at a known truth with Gaussian noise (as lj-posterior.test.ts).
const TRUTH = { epsilonK: 150, sigmaAngstrom: 3.7 };
function table(seed: number): FitMeasurementSet {
  const gauss = gaussianGenerator(mulberry32(seed));
  return {
    id: 'synthetic',
    kind: 'b2',
    rows: [110, 130, 160, 200, 260, 350, 480, 650].map((temperatureK) => {
      const exact = b2WithGradient(temperatureK, TRUTH.epsilonK, TRUTH.sigmaAngstrom).b2Cm3PerMol;
      const uncertainty = 1.5 + 0.02 * Math.abs(exact);
      return { temperatureK, value: exact + uncertainty * gauss(), uncertainty };
    }),
  };
}
const FIT = { restarts: 0, profiles: false } as const;

/** A set's prior: mean, standard errors and correlation as a parameter set stores them. */
function setPrior(epsilonK: number, sigmaAngstrom: number, seE: number, seS: number, r: number): ParameterSetPrior {
  return {
    parameterSetId: 7,
    label: 'Quillmoor gas LJ 12-6 set v1 (approved)',
    epsilonK,
    sigmaAngstrom,
    covariance: [
      [seE * seE, r * seE * seS],
      [r * seE * seS, seS * seS],
    ],
  };
}

describe('Gaussian prior from a previous parameter set', () => {
  const data = [table(11)];
  const fit = fitLennardJones(data, FIT);
  const se = fit.stdErr as { epsilonK: number; sigmaAngstrom: number };
  const run = { noise: 'stated' as const, samples: 600, burnIn: 300, seed: 21, drawsReturned: 0 };

  it('a very tight prior (1 % of the standard errors, 3 standard errors away): the posterior collapses onto the prior', () => {
    // Product of Gaussians: the mean moves from the prior's by (σ_p²/σ_L²)·Δ ≈ 10⁻⁴·3 se, far below the prior's width.
    const prior = setPrior(
      fit.epsilonK + 3 * se.epsilonK,
      fit.sigmaAngstrom - 2 * se.sigmaAngstrom,
      0.01 * se.epsilonK,
      0.01 * se.sigmaAngstrom,
      0.5,
    );
    const post = ljPosterior(data, {}, fit, { ...run, prior });
    const sd = { epsilonK: 0.01 * se.epsilonK, sigmaAngstrom: 0.01 * se.sigmaAngstrom };
    for (const n of ['epsilonK', 'sigmaAngstrom'] as const) {
      expect(Math.abs(post[n].median - prior[n])).toBeLessThan(0.2 * sd[n]);
      // Central 95 % of the prior: ±1.96 sd; within 15 % (Monte-Carlo error of a 95 % quantile from ~600 effective draws).
      expect(Math.abs((post[n].upper95 - post[n].lower95) / (2 * 1.959964 * sd[n]) - 1)).toBeLessThan(0.15);
    }
    expect(post.correlation!).toBeGreaterThan(0.35);
    expect(post.correlation!).toBeLessThan(0.65);
    expect(post.priorSet).toMatchObject({ parameterSetId: 7, epsilonK: prior.epsilonK });
    expect(post.priors).toMatch(/bivariate Gaussian of Quillmoor gas LJ 12-6 set v1 \(approved\)/);
    expect(post.messages.some((m) => /set 7/.test(m))).toBe(true);
  });

  it('a broad prior (100 times the standard errors): the posterior is the flat-prior one within sampling error', () => {
    const flat = ljPosterior(data, {}, fit, run);
    const broad = ljPosterior(data, {}, fit, {
      ...run,
      prior: setPrior(fit.epsilonK, fit.sigmaAngstrom, 100 * se.epsilonK, 100 * se.sigmaAngstrom, -0.9),
    });
    for (const n of ['epsilonK', 'sigmaAngstrom'] as const) {
      // Two independent chains: the Monte-Carlo standard error of a median is √(π/2)·sd/√N_eff (N_eff = walkers·steps/τ,
      // from the sampler's own τ); the medians may differ by 3 of their combined errors, the 95 % ends by 6 (a tail quantile
      // is about twice as noisy as the median; common practice, no source).
      const mcError =
        Math.sqrt(Math.PI / 2) *
        flat[n].standardDeviation *
        Math.sqrt(1 / flat.diagnostics.effectiveSamples + 1 / broad.diagnostics.effectiveSamples);
      expect(Math.abs(broad[n].median - flat[n].median)).toBeLessThan(3 * mcError);
      expect(Math.abs(broad[n].lower95 - flat[n].lower95)).toBeLessThan(6 * mcError);
      expect(Math.abs(broad[n].upper95 - flat[n].upper95)).toBeLessThan(6 * mcError);
      expect(mcError).toBeLessThan(0.2 * se[n]);
    }
  });

  it("with σ held, the prior of ε is the set's Gaussian conditioned on the held σ", () => {
    const prior = setPrior(150, 3.7, 2, 0.02, -0.8);
    const conditional = priorOnFree(prior, ['epsilonK'], { epsilonK: 0, sigmaAngstrom: 3.72 })!;
    // μ_ε|σ = μ_ε + ρ s_ε/s_σ (σ − μ_σ) = 150 − 0.8·100·0.02 = 148.4; s² = s_ε²(1 − ρ²) = 4·0.36 (textbook Gaussian conditioning, no source).
    expect(conditional.mean[0]).toBeCloseTo(148.4, 10);
    expect(conditional.covariance[0][0]).toBeCloseTo(1.44, 10);
  });

  it('a covariance that is not positive definite is refused by the sampler', () => {
    expect(
      choleskyLower([
        [1, 2],
        [2, 1],
      ]),
    ).toBeNull();
    expect(() => ljPosterior(data, {}, fit, { ...run, samples: 20, prior: setPrior(150, 3.7, 1, 0.01, 1.5) })).toThrow(/positive-definite/);
  });

  it('the density posterior takes the same prior: tight collapses onto it, the result names the set', async () => {
    const mean = { epsilonK: 150, sigmaAngstrom: 3.6 };
    const s = { epsilonK: 2, sigmaAngstrom: 0.01 };
    const like = (e: number, g: number) => {
      const x = (e - mean.epsilonK) / s.epsilonK;
      const y = (g - mean.sigmaAngstrom) / s.sigmaAngstrom;
      return { logLikelihood: (-0.5 * (x * x + 1.8 * x * y + y * y)) / (1 - 0.81) };
    };
    const prior = setPrior(153, 3.59, 0.02, 0.0001, 0);
    const post = await densityPosterior(
      {
        free: ['epsilonK', 'sigmaAngstrom'],
        estimate: mean,
        stdErr: s,
        covariance: [
          [4, -0.9 * 2 * 0.01],
          [-0.9 * 2 * 0.01, 1e-4],
        ],
        bounds: { epsilonK: [50, 400], sigmaAngstrom: [2.5, 5] },
        noiseScale: 1,
        evaluate: like,
      },
      { samples: 600, burnIn: 300, seed: 5, prior },
    );
    expect(Math.abs(post.epsilonK.median - 153)).toBeLessThan(0.01);
    expect(Math.abs(post.sigmaAngstrom.median - 3.59)).toBeLessThan(0.00005);
    expect(post.priorSet?.parameterSetId).toBe(7);
  });
});
