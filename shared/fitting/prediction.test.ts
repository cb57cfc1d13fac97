import { describe, expect, it } from 'vitest';
import { b2Interpolated } from '../physics/virial-interpolant';
import { PROPERTY_MODELS } from './property-models';
import { predictWithUncertainty, type PredictionSet } from './prediction';
import { gaussianGenerator, mulberry32 } from './random';

// An invented set (ε/k_B = 150 K, σ = 3.7 Å, standard errors 0.8 K and 0.006 Å, correlation −0.9) and molar mass.
const SE = [0.8, 0.006];
const RHO = -0.9;
const SET: PredictionSet = {
  epsilonK: 150,
  sigmaAngstrom: 3.7,
  covariance: [
    [SE[0] ** 2, RHO * SE[0] * SE[1]],
    [RHO * SE[0] * SE[1], SE[1] ** 2],
  ],
  validity: { temperatureK: [120, 600] },
};
const CONTEXT = { molarMassGPerMol: 58.1, quantumCorrection: false };

/** Correlated normal draws of (ε, σ) from the set's covariance (Cholesky factor; common practice). */
function draws(n: number, seed: number) {
  const g = gaussianGenerator(mulberry32(seed));
  const l11 = SE[0];
  const l21 = RHO * SE[1];
  const l22 = SE[1] * Math.sqrt(1 - RHO * RHO);
  return Array.from({ length: n }, () => {
    const u = g();
    const v = g();
    return { epsilonK: SET.epsilonK + l11 * u, sigmaAngstrom: SET.sigmaAngstrom + l21 * u + l22 * v };
  });
}
const sd = (values: number[]) => {
  const m = values.reduce((s, v) => s + v, 0) / values.length;
  return Math.sqrt(values.reduce((s, v) => s + (v - m) ** 2, 0) / (values.length - 1));
};

describe('predictions with propagated uncertainty', () => {
  it('B2: the first-order standard error matches a Monte-Carlo propagation of the covariance within 2 %', () => {
    const states = [{ temperatureK: 130 }, { temperatureK: 300 }, { temperatureK: 550 }];
    const predicted = predictWithUncertainty('b2', states, SET, CONTEXT);
    const sample = draws(20000, 1);
    states.forEach((s, i) => {
      // 20 000 draws: the Monte-Carlo s.d. is known to 0.5 %; the covariance is small enough for first order to hold.
      const mc = sd(sample.map((d) => b2Interpolated(s.temperatureK, d.epsilonK, d.sigmaAngstrom).b2Cm3PerMol));
      expect(Math.abs(predicted[i].standardError / mc - 1)).toBeLessThan(0.02);
      expect(predicted[i].intervalMethod).toBe('linearised covariance');
    });
  });

  it('viscosity and density: the propagated standard error equals √(gᵀCg) with g from central finite differences', () => {
    const cases = [
      { kind: 'viscosity' as const, state: { temperatureK: 400 } },
      { kind: 'density' as const, state: { temperatureK: 135, pressureMPa: 5 } },
    ];
    for (const { kind, state } of cases) {
      const [p] = predictWithUncertainty(kind, [state], SET, CONTEXT);
      const f = (e: number, s: number) => PROPERTY_MODELS[kind].evaluate(state, e, s, CONTEXT).value;
      const he = 1e-4 * SET.epsilonK;
      const hs = 1e-4 * SET.sigmaAngstrom;
      const g = [
        (f(SET.epsilonK + he, SET.sigmaAngstrom) - f(SET.epsilonK - he, SET.sigmaAngstrom)) / (2 * he),
        (f(SET.epsilonK, SET.sigmaAngstrom + hs) - f(SET.epsilonK, SET.sigmaAngstrom - hs)) / (2 * hs),
      ];
      const c = SET.covariance;
      const fd = Math.sqrt(g[0] * g[0] * c[0][0] + 2 * g[0] * g[1] * c[0][1] + g[1] * g[1] * c[1][1]);
      expect(Math.abs(p.standardError / fd - 1)).toBeLessThan(1e-4);
      expect(p.standardError).toBeGreaterThan(0);
    }
  });

  it('density: the first-order standard error matches a Monte-Carlo propagation within 6 %', () => {
    const state = { temperatureK: 135, pressureMPa: 5 };
    const [p] = predictWithUncertainty('density', [state], SET, CONTEXT);
    const mc = sd(draws(2000, 2).map((d) => PROPERTY_MODELS.density.evaluate(state, d.epsilonK, d.sigmaAngstrom, CONTEXT).value));
    // 2000 draws: Monte-Carlo s.d. known to about 1.6 %.
    expect(Math.abs(p.standardError / mc - 1)).toBeLessThan(0.06);
  });

  it('with posterior draws the interval comes from the draws and agrees with the linear one in the linear regime', () => {
    const [p] = predictWithUncertainty('b2', [{ temperatureK: 200 }], { ...SET, draws: draws(4000, 3) }, CONTEXT);
    expect(p.intervalMethod).toBe('posterior draws');
    const half = (p.upper95 - p.lower95) / 2;
    expect(Math.abs(half / (1.959964 * p.standardError) - 1)).toBeLessThan(0.06);
  });

  it('marks states outside the validity range in plain words', () => {
    const [inside, below] = predictWithUncertainty('b2', [{ temperatureK: 300 }, { temperatureK: 90 }], SET, CONTEXT);
    expect(inside.outsideValidity).toBe(false);
    expect(inside.note).toBeUndefined();
    expect(below.outsideValidity).toBe(true);
    expect(below.note).toMatch(/90 K lies outside the validity range 120–600 K/);
  });
});
