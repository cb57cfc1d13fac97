import { describe, expect, it } from 'vitest';
import { densityWithGradient, massDensityKgPerM3, reducedDensityOf, reducedStateOf } from './corresponding-states';
import { ljEosDensity } from './lj-eos';
import { UNIT_CHECKS } from '../validation/checks/material-checks';
import { itPassesReferenceChecks } from '../validation/reference-check-tests';

describe('corresponding states', () => {
  // Reduced units (Allen & Tildesley 2017, §1.5): for argon-like parameters ε/k_B = 119.8 K, σ = 3.405 Å
  // (Hirschfelder, Curtiss & Bird 1954 values, from memory) the pressure unit ε/σ³ is
  // 119.8 × 1.380649e-23 J / (3.405e-10 m)³ = 41.897 MPa (hand arithmetic with CODATA 2018 k_B).
  it('maps temperature and pressure to T* and P*', () => {
    const s = reducedStateOf({ temperatureK: 119.8, pressureMPa: 41.897, epsilonK: 119.8, sigmaAngstrom: 3.405 });
    expect(s.reducedTemperature).toBe(1);
  });
  // P* of 41.897 MPa and the density unit of argon: registry entries units.argon-*-unit.
  itPassesReferenceChecks(UNIT_CHECKS.filter((c) => c.testFile === 'shared/physics/corresponding-states.test.ts'));

  // Density unit M/(N_A σ³) for argon (M = 39.948 g/mol, IUPAC): 39.948e-3 / (6.02214076e23 × (3.405e-10)³) = 1680 kg/m³.
  it('maps reduced density to mass density and back', () => {
    expect(reducedDensityOf(massDensityKgPerM3(0.8442, 39.948, 3.405), 39.948, 3.405)).toBeCloseTo(0.8442, 12);
  });

  it('gives the (ε, σ) gradient of ρ(T, P) that finite differences of the EOS density give (common practice, no source)', () => {
    const M = 39.948;
    const state = { temperatureK: 130, pressureMPa: 10, epsilonK: 119.8, sigmaAngstrom: 3.405 };
    const rho = (eps: number, sig: number) => {
      const r = reducedStateOf({ ...state, epsilonK: eps, sigmaAngstrom: sig });
      return massDensityKgPerM3(ljEosDensity(r.reducedTemperature, r.reducedPressure).reducedDensity, M, sig);
    };
    const r = reducedStateOf(state);
    const eos = ljEosDensity(r.reducedTemperature, r.reducedPressure);
    const g = densityWithGradient(eos, state, M);
    expect(g.densityKgPerM3).toBeCloseTo(rho(119.8, 3.405), 8);
    const h = 1e-4;
    expect(g.dRhodEpsilonK).toBeCloseTo((rho(119.8 + h, 3.405) - rho(119.8 - h, 3.405)) / (2 * h), 3);
    expect(g.dRhodSigmaAngstrom).toBeCloseTo((rho(119.8, 3.405 + h * 0.01) - rho(119.8, 3.405 - h * 0.01)) / (2 * h * 0.01), 1);
  });
});
