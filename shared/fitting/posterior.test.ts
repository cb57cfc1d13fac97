import { describe, expect, it } from 'vitest';
import {
  credibleRegionOutline,
  gelmanRubin,
  integratedAutocorrelationTime,
  intervalDisagreement,
  PosteriorInputError,
  sampleEnsemble,
  summarise,
} from './posterior';
import { gaussianGenerator, mulberry32 } from './random';

// A correlated bivariate normal (means 10 and 3, s.d. 2 and 0.1, correlation −0.99): the exact central 95 %
// interval is mean ± 1.959964·s.d. (the normal quantile, Abramowitz & Stegun 1964, table 26.1, from memory).
const MEAN = [10, 3];
const SD = [2, 0.1];
const RHO = -0.99;
function logNormal2(x: readonly number[]): number {
  const u = (x[0] - MEAN[0]) / SD[0];
  const v = (x[1] - MEAN[1]) / SD[1];
  return (-0.5 * (u * u - 2 * RHO * u * v + v * v)) / (1 - RHO * RHO);
}
const Z975 = 1.959964;

describe('affine-invariant ensemble sampler (Goodman & Weare 2010)', () => {
  const run = sampleEnsemble(logNormal2, {
    bounds: [
      [-100, 100],
      [-100, 100],
    ],
    initial: [10.5, 2.95],
    initialSpread: [0.01, 0.001],
    walkers: 32,
    steps: 3000,
    burnIn: 500,
    seed: 7,
  });

  it('recovers the intervals of a strongly correlated normal within the Monte-Carlo error', () => {
    for (const k of [0, 1]) {
      const s = summarise(run.samples.map((x) => x[k]));
      // Monte-Carlo error of a 2.5 % quantile with ~3000 effective samples is about 0.05 s.d.; allow 0.15 s.d.
      expect(Math.abs(s.median - MEAN[k])).toBeLessThan(0.1 * SD[k]);
      expect(Math.abs(s.lower95 - (MEAN[k] - Z975 * SD[k]))).toBeLessThan(0.15 * SD[k]);
      expect(Math.abs(s.upper95 - (MEAN[k] + Z975 * SD[k]))).toBeLessThan(0.15 * SD[k]);
      expect(Math.abs(s.standardDeviation / SD[k] - 1)).toBeLessThan(0.05);
    }
    const [a, b] = [0, 1].map((k) => summarise(run.samples.map((x) => x[k])));
    const c =
      run.samples.reduce((s, x) => s + (x[0] - a.mean) * (x[1] - b.mean), 0) /
      (run.samples.length * a.standardDeviation * b.standardDeviation);
    expect(Math.abs(c - RHO)).toBeLessThan(0.003);
  });

  it('reports sane diagnostics: acceptance, τ well below the chain length, R-hat near 1', () => {
    // Goodman & Weare report acceptance 0.2–0.5 with a = 2 on Gaussian targets; τ for a 2-D Gaussian is a few tens of steps
    // whatever the correlation (affine invariance; Foreman-Mackey et al. 2013 §4).
    expect(run.acceptanceFraction).toBeGreaterThan(0.3);
    expect(run.acceptanceFraction).toBeLessThan(0.8);
    for (const tau of run.autocorrelationTime) {
      expect(tau).toBeGreaterThan(2);
      expect(tau).toBeLessThan(60);
    }
    for (const r of run.rHat) expect(r).toBeLessThan(1.05);
    expect(run.converged).toBe(true);
  });

  it('is reproducible with a fixed seed and different with another', () => {
    const opts = {
      bounds: [
        [-100, 100],
        [-100, 100],
      ] as Array<[number, number]>,
      initial: [10, 3],
      initialSpread: [0.1, 0.01],
      steps: 50,
      burnIn: 10,
    };
    const a = sampleEnsemble(logNormal2, { ...opts, seed: 1 });
    const b = sampleEnsemble(logNormal2, { ...opts, seed: 1 });
    const c = sampleEnsemble(logNormal2, { ...opts, seed: 2 });
    expect(b.samples).toEqual(a.samples);
    expect(c.samples).not.toEqual(a.samples);
  });

  it('respects the flat prior bounds and a Gaussian prior', () => {
    // Flat target on [0, 1]² truncated by bounds [0, 0.5] in the first parameter: its median is 0.25.
    const bounded = sampleEnsemble(() => 0, {
      bounds: [
        [0, 0.5],
        [0, 1],
      ],
      initial: [0.25, 0.5],
      initialSpread: [0.05, 0.05],
      steps: 800,
      burnIn: 200,
      seed: 3,
    });
    expect(Math.max(...bounded.samples.map((x) => x[0]))).toBeLessThanOrEqual(0.5);
    expect(Math.abs(summarise(bounded.samples.map((x) => x[0])).median - 0.25)).toBeLessThan(0.02);
    // A Gaussian likelihood N(0, 1) times a Gaussian prior N(2, 1) is N(1, 1/2) (conjugate normal, common practice).
    const prior = sampleEnsemble((x) => -0.5 * x[0] * x[0], {
      bounds: [[-50, 50]],
      initial: [1],
      initialSpread: [0.1],
      gaussianPriors: [{ mean: 2, standardDeviation: 1 }],
      steps: 3000,
      burnIn: 300,
      seed: 4,
    });
    const s = summarise(prior.samples.map((x) => x[0]));
    expect(Math.abs(s.mean - 1)).toBeLessThan(0.05);
    expect(Math.abs(s.standardDeviation - Math.SQRT1_2)).toBeLessThan(0.03);
  });

  it('rejects bad options with a message naming the problem', () => {
    const base = { bounds: [[0, 1]] as Array<[number, number]>, initial: [0.5], initialSpread: [0.1] };
    expect(() => sampleEnsemble(() => 0, { ...base, walkers: 3 })).toThrow(/walkers must be an even integer of at least 4/);
    expect(() => sampleEnsemble(() => 0, { ...base, initial: [2] })).toThrow(/outside its bounds/);
    expect(() => sampleEnsemble(() => -Infinity, base)).toThrow(PosteriorInputError);
  });
});

describe('diagnostics', () => {
  it('integrated autocorrelation time of an AR(1) process is (1 + φ)/(1 − φ) (a textbook result, e.g. Sokal 1997 §2; common practice)', () => {
    const phi = 0.8; // τ = 9
    const gauss = gaussianGenerator(mulberry32(11));
    const traces = Array.from({ length: 20 }, () => {
      const t = new Float64Array(5000);
      let x = 0;
      for (let i = 0; i < t.length; i++) t[i] = x = phi * x + Math.sqrt(1 - phi * phi) * gauss();
      return t;
    });
    expect(Math.abs(integratedAutocorrelationTime(traces) / 9 - 1)).toBeLessThan(0.1);
  });

  it('R-hat is about 1 for chains of one distribution and large for chains stuck apart', () => {
    const gauss = gaussianGenerator(mulberry32(12));
    const same = Array.from({ length: 8 }, () => Array.from({ length: 500 }, () => gauss()));
    const apart = Array.from({ length: 8 }, (_, c) => Array.from({ length: 500 }, () => gauss() + 3 * c));
    expect(Math.abs(gelmanRubin(same) - 1)).toBeLessThan(0.02);
    expect(gelmanRubin(apart)).toBeGreaterThan(2);
  });

  it('the disagreement message appears only when the intervals differ, and says how', () => {
    expect(intervalDisagreement('ε/k_B', 'K', { lower95: 100.2, upper95: 119.9, median: 110 }, { lower95: 100, upper95: 120 })).toBeNull();
    const msg = intervalDisagreement('ε/k_B', 'K', { lower95: 104, upper95: 130, median: 112 }, { lower95: 100, upper95: 120 });
    expect(msg).toMatch(/ε\/k_B: the posterior 95 % interval, 104\.00 to 130\.00 K, differs from the linearised one, 100\.00 to 120\.00 K/);
    expect(msg).toMatch(/30 % wider/);
    expect(msg).toMatch(/lopsided, reaching further toward larger values/);
  });

  it('the credible-region outline surrounds the median and lies within the samples', () => {
    const run = sampleEnsemble(logNormal2, {
      bounds: [
        [-100, 100],
        [-100, 100],
      ],
      initial: [10, 3],
      initialSpread: [0.1, 0.01],
      steps: 400,
      burnIn: 200,
      seed: 5,
    });
    const outline = credibleRegionOutline(run.samples, run.logPosterior);
    expect(outline.length).toBeGreaterThan(40);
    // Points of the 95 % region of a bivariate normal sit at Mahalanobis radius² ≈ χ²₂(0.95) = 5.99 (from memory).
    const r2 = outline.map(([a, b]) => {
      const u = (a - MEAN[0]) / SD[0];
      const v = (b - MEAN[1]) / SD[1];
      return (u * u - 2 * RHO * u * v + v * v) / (1 - RHO * RHO);
    });
    const median = [...r2].sort((x, y) => x - y)[Math.floor(r2.length / 2)];
    expect(median).toBeGreaterThan(4);
    expect(median).toBeLessThan(8);
  });
});
