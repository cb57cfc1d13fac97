import { describe, expect, it } from 'vitest';
import { b2WithGradient } from '../physics/virial';
import { fitLennardJones, type FitMeasurementSet } from './lj-fit';
import { compareModels, fitMieWithExponent, informationCriteria } from './mie-fit';
import { gaussianGenerator, mulberry32 } from './random';

// Synthetic B2 tables from the Mie quadrature (virial.ts, checked against an independent mpmath quadrature in
// mie-potential.test.ts) at a known truth, 0.3 cm³/mol noise over a wide range of T*.
function table(repulsiveExponent: number, seed: number): FitMeasurementSet {
  const g = gaussianGenerator(mulberry32(seed));
  const temps = [90, 105, 120, 140, 165, 200, 250, 320, 420, 560, 750, 1000, 1400];
  return {
    id: `mie-${repulsiveExponent}`,
    kind: 'b2',
    rows: temps.map((t) => ({
      temperatureK: t,
      value: b2WithGradient(t, 150, 3.7, undefined, { repulsiveExponent }).b2Cm3PerMol + 0.3 * g(),
      uncertainty: 0.3,
    })),
  };
}

describe('Mie λr-6 fits', () => {
  it('holds λr: recovers ε and σ of Mie 16-6 data, and the model and λr are on the result', () => {
    const data = [table(16, 1)];
    const fit = fitLennardJones(data, { repulsiveExponent: 16, restarts: 0, profiles: false });
    expect(fit.model).toBe('mie');
    expect(fit.repulsiveExponent).toBe(16);
    expect(Math.abs(fit.epsilonK - 150)).toBeLessThan(3 * (fit.stdErr.epsilonK as number));
    expect(Math.abs(fit.sigmaAngstrom - 3.7)).toBeLessThan(3 * (fit.stdErr.sigmaAngstrom as number));
    expect(fitLennardJones(data, { restarts: 0, profiles: false }).model).toBe('lj-12-6');
  });

  it('fits λr: recovers 16 within its 95 % profile interval, and BIC prefers Mie over 12-6 for these data', () => {
    const data = [table(16, 2)];
    const mie = fitMieWithExponent(data, { restarts: 0 });
    const p = mie.repulsiveExponentProfile;
    expect(p.lower95).not.toBeNull();
    expect(p.upper95).not.toBeNull();
    expect(p.lower95!).toBeLessThan(16);
    expect(p.upper95!).toBeGreaterThan(16);
    expect(p.upper95! - p.lower95!).toBeLessThan(6);
    expect(mie.warnings.some((w) => /λr was fitted by profiling/.test(w))).toBe(true);
    const lj = fitLennardJones(data, { restarts: 0, profiles: false });
    const cmp = compareModels(informationCriteria('LJ 12-6', lj.chi2, 13, 2), informationCriteria('Mie λr-6', mie.chi2, 13, 3));
    expect(cmp.preferred).toBe('Mie λr-6');
    expect(cmp.text).toMatch(/^The data (very strongly|strongly|positively) prefer Mie λr-6 over LJ 12-6 \(ΔBIC = /);
  });

  it('on 12-6 data the extra parameter does not pay: BIC does not prefer the Mie fit', () => {
    const data = [table(12, 3)];
    const mie = fitMieWithExponent(data, { restarts: 0 });
    const lj = fitLennardJones(data, { restarts: 0, profiles: false });
    expect(Math.abs(mie.repulsiveExponentProfile.best - 12)).toBeLessThan(2);
    const cmp = compareModels(informationCriteria('LJ 12-6', lj.chi2, 13, 2), informationCriteria('Mie λr-6', mie.chi2, 13, 3));
    expect(cmp.preferred).not.toBe('Mie λr-6');
  });

  it('refuses a Mie fit of a kind without a Mie model, naming the measurement set', () => {
    // Viscosity has a Mie model now (mie-viscosity-fit.test.ts); B3 still has none.
    const b3: FitMeasurementSet = {
      id: 'b3-1',
      kind: 'b3',
      rows: [
        { temperatureK: 300, value: 2000, uncertainty: 100 },
        { temperatureK: 400, value: 1800, uncertainty: 100 },
        { temperatureK: 500, value: 1600, uncertainty: 100 },
      ],
    };
    expect(() => fitLennardJones([b3], { repulsiveExponent: 16, molarMassGPerMol: 58.1 })).toThrow(
      /b3-1: the third virial coefficient B3 model is for the LJ 12-6 potential only; a Mie 16-6 fit takes B2 and dilute-gas viscosity data today/,
    );
    expect(() => fitLennardJones([table(12, 1)], { repulsiveExponent: 40 })).toThrow(/from 8 to 36, got 40/);
  });
});
