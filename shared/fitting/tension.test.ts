import { describe, expect, it } from 'vitest';
import { b2WithGradient } from '../physics/virial';
import { viscosityWithGradient } from '../physics/viscosity';
import type { FitMeasurementSet } from './lj-fit';
import { gaussianGenerator, mulberry32 } from './random';
import { kindTension, regionsOverlap } from './tension';

const M = 58.1; // g/mol, an invented molar mass
function b2(truth: { epsilonK: number; sigmaAngstrom: number }, seed: number): FitMeasurementSet {
  const g = gaussianGenerator(mulberry32(seed));
  return {
    id: 'b2',
    kind: 'b2',
    rows: [120, 150, 190, 240, 320, 450, 650].map((t) => ({
      temperatureK: t,
      value: b2WithGradient(t, truth.epsilonK, truth.sigmaAngstrom).b2Cm3PerMol + 0.5 * g(),
      uncertainty: 0.5,
    })),
  };
}
function eta(truth: { epsilonK: number; sigmaAngstrom: number }, seed: number): FitMeasurementSet {
  const g = gaussianGenerator(mulberry32(seed));
  return {
    id: 'eta',
    kind: 'viscosity',
    rows: [100, 150, 220, 320, 480, 700, 1000].map((t) => {
      const v = viscosityWithGradient(t, truth.epsilonK, truth.sigmaAngstrom, M).viscosityMicroPaS;
      return { temperatureK: t, value: v * (1 + 0.002 * g()), uncertainty: 0.002 * v };
    }),
  };
}

describe('tension between kinds of data', () => {
  it('ellipse overlap: circles apart, touching and nested', () => {
    const unit = (x: number, y: number, r2 = 1) => ({
      center: [x, y] as [number, number],
      covariance: [
        [1, 0],
        [0, 1],
      ],
      radiusSquared: r2,
    });
    expect(regionsOverlap(unit(0, 0), unit(3, 0))).toBe(false);
    expect(regionsOverlap(unit(0, 0), unit(1.99, 0))).toBe(true);
    expect(regionsOverlap(unit(0, 0, 100), unit(1, 1))).toBe(true);
    // Two thin ellipses crossing like an X overlap; the same shifted along one axis do not.
    const thin = (x: number, c: number) => ({
      center: [x, 0] as [number, number],
      covariance: [
        [1, c],
        [c, 1],
      ],
      radiusSquared: 1,
    });
    expect(regionsOverlap(thin(0, 0.99), thin(0, -0.99))).toBe(true);
    expect(regionsOverlap(thin(0, 0.99), thin(0.5, 0.99))).toBe(false);
  });

  it('B2 and viscosity from the same parameters agree: regions overlap, no message', () => {
    const truth = { epsilonK: 150, sigmaAngstrom: 3.7 };
    const t = kindTension([b2(truth, 1), eta(truth, 2)], { molarMassGPerMol: M, restarts: 0 });
    expect(t.regions.every((r) => r.constrainsBoth)).toBe(true);
    expect(t.pairs).toEqual([{ kinds: ['b2', 'viscosity'], overlap: true }]);
    expect(t.messages).toEqual([]);
  });

  it('viscosity made with a σ 3 % larger: the regions do not overlap and the result says so in plain words', () => {
    const t = kindTension([b2({ epsilonK: 150, sigmaAngstrom: 3.7 }, 1), eta({ epsilonK: 150, sigmaAngstrom: 3.81 }, 2)], {
      molarMassGPerMol: M,
      restarts: 0,
    });
    expect(t.pairs[0].overlap).toBe(false);
    expect(t.messages).toHaveLength(1);
    expect(t.messages[0]).toMatch(
      /^The second virial coefficient B2 and the dilute-gas viscosity pull the parameters apart: fitted alone, their 95 % regions do not overlap/,
    );
    expect(t.regions.every((r) => (r.ellipse95?.length ?? 0) > 0)).toBe(true);
  });

  it('a kind with too few points to fix both parameters is named, not compared', () => {
    const few: FitMeasurementSet = {
      ...b2({ epsilonK: 150, sigmaAngstrom: 3.7 }, 3),
      rows: b2({ epsilonK: 150, sigmaAngstrom: 3.7 }, 3).rows.slice(0, 2),
    };
    const t = kindTension([few, eta({ epsilonK: 150, sigmaAngstrom: 3.7 }, 2)], { molarMassGPerMol: M, restarts: 0 });
    expect(t.regions[0]).toMatchObject({ kind: 'b2', constrainsBoth: false });
    expect(t.regions[0].reason).toMatch(/2 point\(s\) of the second virial coefficient B2 alone cannot fix two parameters/);
    expect(t.pairs).toEqual([]);
  });
});
