import { describe, expect, it } from 'vitest';
import { massDensityKgPerM3, reducedStateOf } from '../physics/corresponding-states';
import { ljEosDensity } from '../physics/lj-eos';
import { runNpt } from '../physics/md/npt';
import { densityPosterior, type ProposalOutcome } from './density-posterior';
import { fitLennardJones } from './lj-fit';
import { Z_95 } from './lj-posterior';
import { mdStageFit, type MdRunSummary, type MdStagePoint, type MdStatePoint } from './md-stage';

// Synthetic densities of an invented substance from the Johnson–Zollweg–Gubbins (1993) LJ equation of state at known
// parameters, as in md-stage.test.ts: two supercritical isotherms (T* = 1.5 and 2.0), far from any phase boundary.
const TRUE = { epsilonK: 150, sigmaAngstrom: 3.6 };
const M = 50;
const STATES: Array<[number, number]> = [
  [225, 20],
  [225, 60],
  [300, 40],
  [300, 100],
];
const RELATIVE_U = 0.01;
const bounds = { epsilonK: [50, 400] as [number, number], sigmaAngstrom: [2.5, 5] as [number, number] };

function syntheticPoints(): MdStagePoint[] {
  return STATES.map(([T, P]) => {
    const s = reducedStateOf({ temperatureK: T, pressureMPa: P, ...TRUE });
    const rho = massDensityKgPerM3(ljEosDensity(s.reducedTemperature, s.reducedPressure).reducedDensity, M, TRUE.sigmaAngstrom);
    return {
      measurementSetId: 1,
      measurementSetIndex: 0,
      kind: 'density' as const,
      temperatureK: T,
      pressureMPa: P,
      value: rho,
      uncertainty: RELATIVE_U * rho,
      weight: 1,
    };
  });
}

describe('posterior of a density fit through the reweighting of the simulation stage', () => {
  it('real NPT runs: the 95 % intervals contain the truth and agree with the linearised ones within a factor 1.5', async () => {
    const points = syntheticPoints();
    const eosStage = fitLennardJones(
      [
        {
          id: 1,
          kind: 'density',
          rows: points.map((p) => ({
            temperatureK: p.temperatureK,
            pressureMPa: p.pressureMPa,
            value: p.value,
            uncertainty: p.uncertainty,
          })),
        },
      ],
      { molarMassGPerMol: M, restarts: 0, bounds },
    );
    let runs = 0;
    // 128 atoms, 5000 steps extended towards 50 effective samples, as the density fit's defaults (density-fit.ts).
    const md = async (states: MdStatePoint[], onRunFinished?: () => void): Promise<MdRunSummary[]> =>
      states.map((s) => {
        runs++;
        const r = runNpt({ ...s, atoms: 128, steps: 5000, seed: 2000 + runs });
        onRunFinished?.();
        return {
          id: runs,
          reused: false,
          reducedDensity: r.reducedDensity,
          stdErr: r.stdErr,
          dRhoDT: r.dRhoDT,
          dRhoDP: r.dRhoDP,
          phase: r.phase,
          ...r.settings,
          effectiveSamples: r.effectiveSamples,
          frames: r.frames,
        };
      });
    const result = await mdStageFit(points, [{ id: 1, kind: 'density' }], {
      start: { epsilonK: eosStage.epsilonK, sigmaAngstrom: eosStage.sigmaAngstrom },
      bounds,
      context: { molarMassGPerMol: M, quantumCorrection: false },
      simulate: md,
      maxIterations: 5,
      posterior: { samples: 300, burnIn: 200, seed: 7 },
    });
    expect(result.status).toBe('succeeded');
    const post = result.posterior!;
    expect(post).toBeDefined();
    for (const n of ['epsilonK', 'sigmaAngstrom'] as const) {
      expect(post[n].lower95).toBeLessThan(TRUE[n]);
      expect(post[n].upper95).toBeGreaterThan(TRUE[n]);
      // The stated factor: the posterior half-width within 1/1.5 … 1.5 of 1.96 linearised standard errors. (Both rest on
      // the same s² = χ²/ν; they differ by the curvature of ρ(ε, σ) and by the θ-dependence of the MD error.)
      const ratio = (post[n].upper95 - post[n].lower95) / (2 * Z_95 * result.stdErr[n]!);
      expect(ratio).toBeGreaterThan(1 / 1.5);
      expect(ratio).toBeLessThan(1.5);
      expect(post.diagnostics.rHat[n]).toBeLessThan(1.1);
      expect(post.diagnostics.autocorrelationTimeSteps[n]).toBeGreaterThan(1);
    }
    // Strong ε–σ correlation, as the linearised covariance has it.
    expect(Math.sign(post.correlation!)).toBe(Math.sign(result.correlation!));
    // Every proposal was either predicted by reweighting or refused and counted; what was refused is small or was run.
    expect(post.coverage.proposals).toBeGreaterThan(0);
    expect(post.coverage.refusedFraction).toBeLessThan(0.02);
    expect(post.coverage.extraRuns).toBe(result.mdRuns.filter((r) => r.purpose === 'posterior').length);
    expect(post.likelihood).toMatch(/MBAR/);
    expect(post.draws.length).toBeGreaterThan(100);
  }, 600_000);
});

describe('density posterior: coverage of the stored runs (analytic likelihood, no simulation)', () => {
  // A correlated Gaussian likelihood in (ε, σ) standing in for the reweighted one, "covered" only within a radius of
  // Mahalanobis distance `reach` of the runs made so far; extend() adds runs at the asked points and widens the reach.
  const mean = { epsilonK: 150, sigmaAngstrom: 3.6 };
  const se = { epsilonK: 2, sigmaAngstrom: 0.01 };
  const rho = -0.9;
  const mahalanobis = (e: number, s: number, centre = mean) => {
    const x = (e - centre.epsilonK) / se.epsilonK;
    const y = (s - centre.sigmaAngstrom) / se.sigmaAngstrom;
    return (x * x - 2 * rho * x * y + y * y) / (1 - rho * rho);
  };
  const covariance = [
    [se.epsilonK ** 2, rho * se.epsilonK * se.sigmaAngstrom],
    [rho * se.epsilonK * se.sigmaAngstrom, se.sigmaAngstrom ** 2],
  ];
  const input = (runsAt: Array<{ epsilonK: number; sigmaAngstrom: number }>, reach: number) => ({
    free: ['epsilonK', 'sigmaAngstrom'] as const,
    estimate: mean,
    stdErr: se,
    covariance,
    bounds,
    noiseScale: 1,
    evaluate: (e: number, s: number): ProposalOutcome =>
      runsAt.some((c) => mahalanobis(e, s, c) < reach * reach) ? { logLikelihood: -0.5 * mahalanobis(e, s) } : { refused: 'uncovered' },
    extend: async (at: Array<{ epsilonK: number; sigmaAngstrom: number }>) => {
      runsAt.push(...at);
      return at.length * 4;
    },
  });

  it('a wide reach: nothing refused, no extra round, and the intervals are the Gaussian ones (±1.96 se within 10 %)', async () => {
    const post = await densityPosterior(input([mean], 10), { samples: 1000, seed: 3 });
    expect(post.coverage.refusedFraction).toBe(0);
    expect(post.coverage.extraRounds).toBe(0);
    for (const n of ['epsilonK', 'sigmaAngstrom'] as const) {
      expect(Math.abs((post[n].upper95 - post[n].lower95) / (2 * Z_95 * se[n]) - 1)).toBeLessThan(0.1);
    }
    expect(post.messages.some((m) => /reach/.test(m))).toBe(false);
  });

  it('a narrow reach: proposals are refused and counted, an extra round runs where they went, and the sampling repeats', async () => {
    const runsAt = [{ ...mean }];
    const post = await densityPosterior(input(runsAt, 1.5), { samples: 600, seed: 3, extraRounds: 1 });
    expect(post.coverage.refusedFractionBySampling[0]).toBeGreaterThan(0.02);
    expect(post.coverage.extraRounds).toBe(1);
    expect(post.coverage.extraRuns).toBeGreaterThan(0);
    expect(runsAt.length).toBeGreaterThan(1);
    // The new runs lie on the long axis on both sides: the refused fraction falls.
    expect(post.coverage.refusedFractionBySampling[1]).toBeLessThan(post.coverage.refusedFractionBySampling[0]);
  });

  it('with no extra round allowed, a restricted posterior says so in words', async () => {
    const post = await densityPosterior(input([{ ...mean }], 1.2), { samples: 300, seed: 3, extraRounds: 0 });
    expect(post.coverage.extraRounds).toBe(0);
    expect(post.coverage.refusedFraction).toBeGreaterThan(0.02);
    expect(post.messages.some((m) => /restricted to the reach of the runs/.test(m))).toBe(true);
    // Restricted to a disc of radius 1.2 in Mahalanobis distance, the interval is narrower than the Gaussian one.
    expect(post.epsilonK.upper95 - post.epsilonK.lower95).toBeLessThan(2 * Z_95 * se.epsilonK);
  });
});
