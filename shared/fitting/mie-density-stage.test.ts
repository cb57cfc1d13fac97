import { describe, expect, it } from 'vitest';
import { massDensityKgPerM3, reducedStateOf } from '../physics/corresponding-states';
import { ljEosDensity } from '../physics/lj-eos';
import { runNpt } from '../physics/md/npt';
import { mdStageFit, type MdRunSummary, type MdStagePoint, type MdStatePoint } from './md-stage';

// A synthetic round trip of a Mie 16-6 density fit through the simulation stage. No equation of state of the Mie fluid
// is built in, so the "measured" densities are NPT runs of the Mie 16-6 kernel at the true reduced states (their own
// seeds, independent of the fit's runs), with 1 % uncertainty plus the run's standard error. Invented substance.
const TRUE = { epsilonK: 150, sigmaAngstrom: 3.6 };
const LAMBDA = 16;
const M = 50;
const STATES: Array<[number, number]> = [
  [225, 20],
  [225, 60],
  [300, 40],
  [300, 100],
];
const ATOMS = 128;
const STEPS = 5000;
const bounds = { epsilonK: [50, 400] as [number, number], sigmaAngstrom: [2.5, 5] as [number, number] };

describe('Mie 16-6 density fit through the simulation stage (λr held)', () => {
  it('recovers ε and σ from Mie densities within 2.5 standard errors', async () => {
    const points: MdStagePoint[] = STATES.map(([T, P], k) => {
      const s = reducedStateOf({ temperatureK: T, pressureMPa: P, ...TRUE });
      const r = runNpt({ ...s, atoms: ATOMS, steps: STEPS, seed: 900 + k, repulsiveExponent: LAMBDA });
      const rho = massDensityKgPerM3(r.reducedDensity, M, TRUE.sigmaAngstrom);
      const u = Math.hypot(0.01 * rho, massDensityKgPerM3(r.stdErr, M, TRUE.sigmaAngstrom));
      return {
        measurementSetId: 1,
        measurementSetIndex: 0,
        kind: 'density' as const,
        temperatureK: T,
        pressureMPa: P,
        value: rho,
        uncertainty: u,
        weight: 1,
      };
    });
    // The Mie 16-6 fluid is not the LJ fluid at the same reduced state: at least one density differs from the LJ
    // equation of state (Johnson et al. 1993) by more than its uncertainty, so the kernel matters to the answer.
    const ljGap = points.map((p) => {
      const s = reducedStateOf({ temperatureK: p.temperatureK, pressureMPa: p.pressureMPa!, ...TRUE });
      return (
        Math.abs(
          massDensityKgPerM3(ljEosDensity(s.reducedTemperature, s.reducedPressure).reducedDensity, M, TRUE.sigmaAngstrom) - p.value,
        ) / p.uncertainty
      );
    });
    expect(Math.max(...ljGap)).toBeGreaterThan(1);

    let runs = 0;
    const md = async (states: MdStatePoint[], onRunFinished?: () => void): Promise<MdRunSummary[]> =>
      states.map((s) => {
        runs++;
        const r = runNpt({ ...s, atoms: ATOMS, steps: STEPS, seed: 3000 + runs, repulsiveExponent: LAMBDA });
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
      start: { epsilonK: TRUE.epsilonK * 1.03, sigmaAngstrom: TRUE.sigmaAngstrom * 0.99 },
      startMethod: 'the given start values',
      bounds,
      context: { molarMassGPerMol: M, quantumCorrection: false, repulsiveExponent: LAMBDA },
      simulate: md,
      maxIterations: 5,
    });
    expect(result.status).toBe('succeeded');
    expect(result.stoppedBy).toBe('converged');
    expect([result.model, result.repulsiveExponent]).toEqual(['mie', LAMBDA]);
    expect(result.start.method).toBe('the given start values');
    const se = result.stdErr as { epsilonK: number; sigmaAngstrom: number };
    expect(Math.abs(result.epsilonK - TRUE.epsilonK)).toBeLessThan(2.5 * se.epsilonK);
    expect(Math.abs(result.sigmaAngstrom - TRUE.sigmaAngstrom)).toBeLessThan(2.5 * se.sigmaAngstrom);
  }, 600_000);
});
