import { describe, expect, it } from 'vitest';
import { massDensityKgPerM3, reducedStateOf } from '../physics/corresponding-states';
import { ljEosDensity } from '../physics/lj-eos';
import { runNpt } from '../physics/md/npt';
import { fitLennardJones } from './lj-fit';
import { mdStageFit, type MdRunSummary, type MdStagePoint, type MdStatePoint } from './md-stage';

// Synthetic densities of an invented substance from the Johnson–Zollweg–Gubbins (1993) LJ equation of state
// at known parameters; two supercritical isotherms (T* = 1.5 and 2.0) so no state is near a phase boundary.
const TRUE = { epsilonK: 150, sigmaAngstrom: 3.6 };
const M = 50;
const STATES: Array<[number, number]> = [
  [225, 20],
  [225, 60],
  [300, 40],
  [300, 100],
];
const RELATIVE_U = 0.01;

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

const bounds = { epsilonK: [50, 400] as [number, number], sigmaAngstrom: [2.5, 5] as [number, number] };
const context = { molarMassGPerMol: M, quantumCorrection: false };

describe('simulation stage of a density fit', () => {
  it('with the equation of state as its predictor it converges to the equation-of-state fit (common practice, no source)', async () => {
    const points = syntheticPoints();
    const eosPredictor = async (states: MdStatePoint[]): Promise<MdRunSummary[]> =>
      states.map((s, i) => {
        const e = ljEosDensity(s.reducedTemperature, s.reducedPressure);
        return { id: i, reused: false, reducedDensity: e.reducedDensity, stdErr: 1e-4, dRhoDT: e.dRhoDT, dRhoDP: e.dRhoDP, phase: 'fluid' };
      });
    const result = await mdStageFit(points, [{ id: 1, kind: 'density' }], {
      start: { epsilonK: 140, sigmaAngstrom: 3.5 },
      bounds,
      context,
      simulate: eosPredictor,
      maxIterations: 10,
      changeInStandardErrors: 0.25,
    });
    expect(result.convergence).toBe('parameter-change');
    // Stopping rule (set to a quarter of a standard error here): the answer is that close.
    // (Noise-free data: χ² ≈ 0, so the rule uses the unscaled covariance, i.e. the stated uncertainties.)
    const u = result.covarianceUnscaled!;
    expect(Math.abs(result.epsilonK - TRUE.epsilonK)).toBeLessThan(0.25 * Math.sqrt(u[0][0]));
    expect(Math.abs(result.sigmaAngstrom - TRUE.sigmaAngstrom)).toBeLessThan(0.25 * Math.sqrt(u[1][1]));
    expect(result.stoppingRule).toMatch(/converged/);
  });

  it('leaves a frozen state point out with a warning', async () => {
    const points = syntheticPoints();
    const predictor = async (states: MdStatePoint[]): Promise<MdRunSummary[]> =>
      states.map((s, i) => {
        const e = ljEosDensity(s.reducedTemperature, s.reducedPressure);
        return {
          id: i,
          reused: false,
          reducedDensity: e.reducedDensity,
          stdErr: 1e-3,
          dRhoDT: e.dRhoDT,
          dRhoDP: e.dRhoDP,
          phase: i === 1 ? 'solid' : 'fluid',
        };
      });
    const result = await mdStageFit(points, [{ id: 1, kind: 'density' }], {
      start: TRUE,
      bounds,
      context,
      simulate: predictor,
      maxIterations: 3,
    });
    expect(result.residuals[1]).toMatchObject({ included: false });
    expect(result.dof).toBe(1);
    expect(result.warnings.some((w) => /ordered solid/.test(w))).toBe(true);
  });

  it('a synthetic round trip with real NPT runs: within 2 standard errors of the truth, converged by reweighting', async () => {
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
    expect(eosStage.status).toBe('succeeded');
    let runs = 0;
    let finishedCalls = 0;
    // 128 atoms, 5000 steps extended towards 50 effective samples: frames and settings as the job queue hands them over.
    const md = async (states: MdStatePoint[], onRunFinished?: () => void): Promise<MdRunSummary[]> =>
      states.map((s) => {
        runs++;
        const r = runNpt({ ...s, atoms: 128, steps: 5000, seed: 1000 + runs });
        onRunFinished?.();
        finishedCalls++;
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
          startedFrom: r.startedFrom,
          frames: r.frames,
        };
      });
    const progress: number[] = [];
    // Started 4 % off in ε and 1.5 % in σ (several standard errors), so the stage has to walk, on reweighted predictions.
    const start = { epsilonK: eosStage.epsilonK * 1.04, sigmaAngstrom: eosStage.sigmaAngstrom * 0.985 };
    const result = await mdStageFit(points, [{ id: 1, kind: 'density' }], {
      start,
      bounds,
      context,
      simulate: md,
      maxIterations: 5,
      onProgress: (p) => progress.push(p.fraction),
    });
    expect(result.status).toBe('succeeded');
    const se = result.stdErr as { epsilonK: number; sigmaAngstrom: number };
    expect(Math.abs(result.epsilonK - TRUE.epsilonK)).toBeLessThan(2 * se.epsilonK);
    expect(Math.abs(result.sigmaAngstrom - TRUE.sigmaAngstrom)).toBeLessThan(2 * se.sigmaAngstrom);
    // The two stages agree within their combined uncertainties.
    expect(Math.abs(result.epsilonK - eosStage.epsilonK)).toBeLessThan(2 * Math.hypot(se.epsilonK, eosStage.stdErr.epsilonK ?? 0));
    expect(Math.abs(result.sigmaAngstrom - eosStage.sigmaAngstrom)).toBeLessThan(
      2 * Math.hypot(se.sigmaAngstrom, eosStage.stdErr.sigmaAngstrom ?? 0),
    );
    expect(result.residuals.every((r) => r.modelUncertainty > 0)).toBe(true);
    // Stopped because the step was inside the noise, with the steps in between taken on reweighted predictions.
    expect(result.stoppedBy).toBe('converged');
    expect(result.mdRounds).toBe(result.mdIterations.length);
    expect(result.newRuns).toBe(runs);
    expect(result.mdRuns).toHaveLength(runs);
    expect(result.reweightedPoints).toBeGreaterThan(0);
    for (const r of result.residuals) expect(r.effectiveSamples).toBeGreaterThan(0);
    // Progress moves with every finished run and never goes back.
    expect(finishedCalls).toBe(runs);
    expect(progress.length).toBeGreaterThan(runs);
    for (let i = 1; i < progress.length; i++) expect(progress[i]).toBeGreaterThanOrEqual(progress[i - 1]);
  }, 600_000);

  it('says so instead of simulating a point the equation of state puts in the solid region', async () => {
    // 100 K at 600 MPa for ε/k_B = 150 K, σ = 3.6 Å is T* = 0.67, P* = 18.9: below the triple-point temperature and
    // far beyond the liquid at freezing (Mastny & de Pablo 2007; ../physics/eos/lj-freezing.ts).
    const points = [
      ...syntheticPoints(),
      {
        measurementSetId: 1,
        measurementSetIndex: 0,
        kind: 'density' as const,
        temperatureK: 100,
        pressureMPa: 600,
        value: 1500,
        uncertainty: 15,
        weight: 1,
      },
    ];
    const asked: MdStatePoint[] = [];
    const predictor = async (states: MdStatePoint[]): Promise<MdRunSummary[]> =>
      states.map((s, i) => {
        asked.push(s);
        const e = ljEosDensity(s.reducedTemperature, s.reducedPressure);
        return {
          id: asked.length + i,
          reused: false,
          reducedDensity: e.reducedDensity,
          stdErr: 1e-4,
          dRhoDT: e.dRhoDT,
          dRhoDP: e.dRhoDP,
          phase: 'fluid',
        };
      });
    const result = await mdStageFit(points, [{ id: 1, kind: 'density' }], {
      start: TRUE,
      bounds,
      context,
      simulate: predictor,
      maxIterations: 3,
    });
    expect(asked.every((s) => s.reducedTemperature > 0.7)).toBe(true);
    expect(result.residuals[4]).toMatchObject({ included: false });
    expect(result.warnings.some((w) => /solid/.test(w) && /100\.00 K/.test(w))).toBe(true);
  });
});
