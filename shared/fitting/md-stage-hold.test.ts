/**
 * The simulation stage of a density fit with a held parameter and with a row left out. The predictor is
 * the Johnson–Zollweg–Gubbins (1993) LJ equation of state with its own derivatives, as in md-stage.test.ts,
 * so the answer is known exactly; the data are synthetic densities of an invented substance.
 */
import { describe, expect, it } from 'vitest';
import { massDensityKgPerM3, reducedStateOf } from '../physics/corresponding-states';
import { ljEosDensity } from '../physics/lj-eos';
import { mdStageFit, type MdRunSummary, type MdStagePoint, type MdStatePoint } from './md-stage';

const TRUE = { epsilonK: 150, sigmaAngstrom: 3.6 };
const M = 50;
// Supercritical isotherms T* = 1.5 and 2.0: no state near a phase boundary.
const STATES: Array<[number, number]> = [
  [225, 20],
  [225, 60],
  [300, 40],
  [300, 100],
  [300, 150],
];

function points(): MdStagePoint[] {
  return STATES.map(([T, P], i) => {
    const s = reducedStateOf({ temperatureK: T, pressureMPa: P, ...TRUE });
    const rho = massDensityKgPerM3(ljEosDensity(s.reducedTemperature, s.reducedPressure).reducedDensity, M, TRUE.sigmaAngstrom);
    // A small deterministic scatter (±0.5 %) so χ² is not zero.
    const value = rho * (1 + 0.005 * Math.sin(1.3 * i + 0.4));
    return {
      measurementSetId: 1,
      measurementSetIndex: 0,
      kind: 'density' as const,
      rowNumber: i + 1,
      temperatureK: T,
      pressureMPa: P,
      value,
      uncertainty: 0.01 * rho,
      weight: 1,
    };
  });
}

const eosPredictor = async (states: MdStatePoint[]): Promise<MdRunSummary[]> =>
  states.map((s, i) => {
    const e = ljEosDensity(s.reducedTemperature, s.reducedPressure);
    return { id: i, reused: false, reducedDensity: e.reducedDensity, stdErr: 1e-5, dRhoDT: e.dRhoDT, dRhoDP: e.dRhoDP, phase: 'fluid' };
  });

const options = {
  bounds: { epsilonK: [50, 400] as [number, number], sigmaAngstrom: [2.5, 5] as [number, number] },
  context: { molarMassGPerMol: M, quantumCorrection: false },
  simulate: eosPredictor,
  maxIterations: 10,
  changeInStandardErrors: 0.25,
};

describe('simulation stage: held parameter and rows left out', () => {
  it('keeps a held σ exact, without standard error, and counts one parameter fewer', async () => {
    const free = await mdStageFit(points(), [{ id: 1, kind: 'density' }], { ...options, start: { epsilonK: 140, sigmaAngstrom: 3.5 } });
    const held = await mdStageFit(points(), [{ id: 1, kind: 'density' }], {
      ...options,
      start: { epsilonK: 140, sigmaAngstrom: 3.6 },
      held: 'sigmaAngstrom',
    });
    expect(held.sigmaAngstrom).toBe(3.6);
    expect(held.stdErr.sigmaAngstrom).toBeNull();
    expect(held.stdErr.epsilonK).toBeGreaterThan(0);
    expect(held.heldParameters).toEqual(['sigmaAngstrom']);
    expect(held.correlation).toBeNull();
    // ν = N − free parameters (Bevington & Robinson 2003, §6.4, from memory).
    expect(held.dof).toBe(STATES.length - 1);
    expect(free.dof).toBe(STATES.length - 2);
    // σ held at its true value: ε comes back within its standard errors of the truth.
    expect(Math.abs(held.epsilonK - TRUE.epsilonK)).toBeLessThan(3 * held.stdErr.epsilonK!);
  });

  it('leaves a row out of χ² and ν but predicts and flags it', async () => {
    const data = points();
    data[2] = { ...data[2], value: data[2].value * 1.2, excluded: true };
    const result = await mdStageFit(data, [{ id: 1, kind: 'density' }], { ...options, start: { epsilonK: 140, sigmaAngstrom: 3.5 } });
    const clean = await mdStageFit(
      points().filter((_, i) => i !== 2),
      [{ id: 1, kind: 'density' }],
      { ...options, start: { epsilonK: 140, sigmaAngstrom: 3.5 } },
    );
    expect(result.dof).toBe(STATES.length - 1 - 2);
    expect(result.residuals[2]).toMatchObject({ excluded: true, included: false, rowNumber: 3 });
    expect(result.residuals[2].predicted).toBeGreaterThan(0);
    // The left-out point shows its misfit (20 % high) but does not pull the fit: the answer is that of the other rows.
    expect(result.residuals[2].relativeDeviationPercent!).toBeLessThan(-10);
    expect(Math.abs(result.epsilonK - clean.epsilonK)).toBeLessThan(0.25 * clean.stdErr.epsilonK!);
    expect(result.perMeasurementSet[0]).toMatchObject({ points: STATES.length - 1, excludedPoints: 1 });
  });
});
