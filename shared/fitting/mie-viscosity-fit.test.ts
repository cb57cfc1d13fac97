import { describe, expect, it } from 'vitest';
import { b2WithGradient } from '../physics/virial';
import { viscosityWithGradient } from '../physics/viscosity';
import { fitLennardJones, type FitMeasurementSet } from './lj-fit';
import { fitMieWithExponent } from './mie-fit';
import { PROPERTY_MODELS } from './property-models';
import { gaussianGenerator, mulberry32 } from './random';

// Synthetic round trip: B2 (virial.ts Mie quadrature, checked against mpmath in mie-potential.test.ts) and dilute-gas
// viscosity (Chapman–Enskog with the Mie collision integrals, checked against an independent scipy quadrature in
// mie-collision-integrals.test.ts) of an invented Mie 16-6 gas, with Gaussian noise of the stated uncertainty (fixed seeds).
const TRUTH = { epsilonK: 150, sigmaAngstrom: 3.7, repulsiveExponent: 16, molarMassGPerMol: 58.1 };

function b2Table(seed: number): FitMeasurementSet {
  const g = gaussianGenerator(mulberry32(seed));
  const temps = [90, 105, 120, 140, 165, 200, 250, 320, 420, 560, 750, 1000, 1400];
  const rows = temps.map((T) => ({
    temperatureK: T,
    value: b2WithGradient(T, TRUTH.epsilonK, TRUTH.sigmaAngstrom, undefined, { repulsiveExponent: 16 }).b2Cm3PerMol + 0.3 * g(),
    uncertainty: 0.3,
  }));
  return { id: 'b2-mie-16', kind: 'b2', rows };
}

/** η with 0.3 % relative uncertainty, as oscillating-disc data of a dilute gas commonly state. */
function viscosityTable(seed: number): FitMeasurementSet {
  const g = gaussianGenerator(mulberry32(seed));
  const temps = [120, 150, 190, 240, 300, 380, 480, 600, 760, 950, 1200];
  const rows = temps.map((T) => {
    const eta = viscosityWithGradient(T, TRUTH.epsilonK, TRUTH.sigmaAngstrom, TRUTH.molarMassGPerMol, {
      repulsiveExponent: 16,
    }).viscosityMicroPaS;
    return { temperatureK: T, value: eta * (1 + 0.003 * g()), uncertainty: 0.003 * eta };
  });
  return { id: 'eta-mie-16', kind: 'viscosity', rows };
}

const options = { molarMassGPerMol: TRUTH.molarMassGPerMol, restarts: 0, profiles: false } as const;

describe('Mie λr-6 fits with viscosity data', () => {
  it('the viscosity model takes a Mie potential; λr = 12 in the context is the 12-6 model to the last digit', () => {
    expect(PROPERTY_MODELS.viscosity.supportsMie).toBe(true);
    const lj = PROPERTY_MODELS.viscosity.evaluate({ temperatureK: 300 }, 150, 3.7, { molarMassGPerMol: 58.1, quantumCorrection: false });
    expect(viscosityWithGradient(300, 150, 3.7, 58.1, { repulsiveExponent: 12 }).viscosityMicroPaS).toBe(lj.value);
    const mie = PROPERTY_MODELS.viscosity.evaluate({ temperatureK: 300 }, 150, 3.7, {
      molarMassGPerMol: 58.1,
      quantumCorrection: false,
      repulsiveExponent: 16,
    });
    expect(mie.value).toBe(viscosityWithGradient(300, 150, 3.7, 58.1, { repulsiveExponent: 16 }).viscosityMicroPaS);
    expect(mie.value).not.toBe(lj.value);
  });

  it('viscosity alone, λr held at 16: recovers ε and σ within 2 standard errors', () => {
    const fit = fitLennardJones([viscosityTable(11)], { ...options, repulsiveExponent: 16 });
    expect(fit.status).toBe('succeeded');
    expect([fit.model, fit.repulsiveExponent]).toEqual(['mie', 16]);
    expect(Math.abs(fit.epsilonK - TRUTH.epsilonK)).toBeLessThan(2 * (fit.stdErr.epsilonK as number));
    expect(Math.abs(fit.sigmaAngstrom - TRUTH.sigmaAngstrom)).toBeLessThan(2 * (fit.stdErr.sigmaAngstrom as number));
  });

  it('B2 and viscosity together, λr held at 16: recovers ε and σ within 2 standard errors, tighter than viscosity alone', () => {
    const joint = fitLennardJones([b2Table(12), viscosityTable(13)], { ...options, repulsiveExponent: 16 });
    const alone = fitLennardJones([viscosityTable(13)], { ...options, repulsiveExponent: 16 });
    expect(joint.status).toBe('succeeded');
    expect(Math.abs(joint.epsilonK - TRUTH.epsilonK)).toBeLessThan(2 * (joint.stdErr.epsilonK as number));
    expect(Math.abs(joint.sigmaAngstrom - TRUTH.sigmaAngstrom)).toBeLessThan(2 * (joint.stdErr.sigmaAngstrom as number));
    expect(joint.stdErr.epsilonK as number).toBeLessThan(alone.stdErr.epsilonK as number);
  });

  it('B2 and viscosity together, λr fitted by profile: recovers 16 within 2 profile standard errors and inside its 95 % interval', () => {
    const fit = fitMieWithExponent([b2Table(14), viscosityTable(15)], { molarMassGPerMol: TRUTH.molarMassGPerMol, restarts: 0 });
    expect(fit.status).toBe('succeeded');
    const p = fit.repulsiveExponentProfile;
    expect(p.stdErr).not.toBeNull();
    expect(Math.abs(p.best - TRUTH.repulsiveExponent)).toBeLessThan(2 * (p.stdErr as number));
    expect(p.lower95 as number).toBeLessThan(16);
    expect(p.upper95 ?? 36).toBeGreaterThan(16);
    // ε and σ at the best λr (their standard errors are conditional on it): within 2 SE of the truth plus the shift
    // that λr's own error carries, bounded here by 3 SE.
    expect(Math.abs(fit.epsilonK - TRUTH.epsilonK)).toBeLessThan(3 * (fit.stdErr.epsilonK as number));
    expect(Math.abs(fit.sigmaAngstrom - TRUTH.sigmaAngstrom)).toBeLessThan(3 * (fit.stdErr.sigmaAngstrom as number));
  });
});
