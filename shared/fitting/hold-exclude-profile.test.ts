/**
 * A held parameter, rows left out, the profile-χ² intervals, the strong-correlation warning and a failed
 * fit's last iterate. The data are generated from the LJ B2 model itself at invented parameters (no
 * substance is meant), so every expected value below is computed independently of the fit code.
 */
import { describe, expect, it } from 'vitest';
import { b2WithGradient } from '../physics/virial';
import { fitLennardJones, LjFitInputError, type FitMeasurementSet } from './lj-fit';
import { profileChi2 } from './profile-chi2';
import { gaussianGenerator, mulberry32 } from './random';

const TEMPERATURES = [150, 180, 220, 260, 300, 360, 420, 500, 600, 750];

/** B2 of invented parameters with seeded Gaussian noise of u per point. */
function measurementSet(u: (b2: number) => number, seed = 7, epsilonK = 210, sigmaAngstrom = 3.9): FitMeasurementSet {
  const gauss = gaussianGenerator(mulberry32(seed));
  return {
    id: 'invented-b2',
    kind: 'b2',
    rows: TEMPERATURES.map((temperatureK) => {
      const exact = b2WithGradient(temperatureK, epsilonK, sigmaAngstrom).b2Cm3PerMol;
      const uncertainty = u(exact);
      return { temperatureK, value: exact + uncertainty * gauss(), uncertainty };
    }),
  };
}

const chi2Of = (d: FitMeasurementSet, eps: number, sigma: number) =>
  d.rows.reduce((s, r) => s + ((b2WithGradient(r.temperatureK, eps, sigma).b2Cm3PerMol - r.value) / r.uncertainty) ** 2, 0);

describe('holding a parameter', () => {
  const data = measurementSet(() => 2);
  const free = fitLennardJones([data], { profiles: false });

  it('keeps the held value exact, gives it no standard error, and counts one parameter fewer in the degrees of freedom', () => {
    // ν = N − (number of adjusted parameters): Bevington & Robinson, "Data Reduction and Error Analysis" (2003), §6.4 (from memory).
    const held = fitLennardJones([data], { fixed: { sigmaAngstrom: 3.85 } });
    expect(held.status).toBe('succeeded');
    expect(held.sigmaAngstrom).toBe(3.85);
    expect(held.heldParameters).toEqual(['sigmaAngstrom']);
    expect(held.stdErr.sigmaAngstrom).toBeNull();
    expect(held.correlation).toBeNull();
    expect(held.profiles.sigmaAngstrom).toBeNull();
    expect(held.dof).toBe(TEMPERATURES.length - 1);
    expect(free.dof).toBe(TEMPERATURES.length - 2);
    // ε minimises χ² along σ = 3.85: both neighbours are worse.
    const at = chi2Of(data, held.epsilonK, 3.85);
    expect(held.chi2).toBeCloseTo(at, 8);
    expect(chi2Of(data, held.epsilonK * 1.001, 3.85)).toBeGreaterThan(at);
    expect(chi2Of(data, held.epsilonK * 0.999, 3.85)).toBeGreaterThan(at);
    // One-parameter standard error from a central-difference derivative: s·(Σ (∂r/∂ε)²)^−½ with s² = χ²/(N − 1)
    // (Press et al., "Numerical Recipes", 3rd ed. (2007), §15.4, from memory).
    const h = 1e-4 * held.epsilonK;
    const sumJ2 = data.rows.reduce((s, r) => {
      const d =
        (b2WithGradient(r.temperatureK, held.epsilonK + h, 3.85).b2Cm3PerMol -
          b2WithGradient(r.temperatureK, held.epsilonK - h, 3.85).b2Cm3PerMol) /
        (2 * h);
      return s + (d / r.uncertainty) ** 2;
    }, 0);
    const expected = Math.sqrt(held.chi2 / (TEMPERATURES.length - 1) / sumJ2);
    expect(held.stdErr.epsilonK!).toBeCloseTo(expected, 6);
  });

  it('held at the free optimum, the other parameter lands on the free optimum too', () => {
    const held = fitLennardJones([data], { fixed: { epsilonK: free.epsilonK }, profiles: false });
    expect(held.epsilonK).toBe(free.epsilonK);
    expect(held.sigmaAngstrom).toBeCloseTo(free.sigmaAngstrom, 6);
    expect(held.chi2).toBeCloseTo(free.chi2, 6);
  });

  it('refuses holding both parameters', () => {
    expect(() => fitLennardJones([data], { fixed: { epsilonK: 200, sigmaAngstrom: 3.8 } })).toThrow(
      /only one of epsilonK and sigmaAngstrom can be held/,
    );
  });
});

describe('leaving rows out', () => {
  const data = measurementSet(() => 2, 11);
  // Two rows pushed far off, as a bad reading would be.
  data.rows[1] = { ...data.rows[1], value: data.rows[1].value + 40 };
  data.rows[6] = { ...data.rows[6], value: data.rows[6].value - 30 };

  it('gives the fit of the remaining rows exactly, and reports the left-out rows with their predictions', () => {
    const leftOut = fitLennardJones([{ ...data, excludeRows: [2, 7] }], { profiles: false });
    const without = fitLennardJones([{ ...data, rows: data.rows.filter((_, i) => i !== 1 && i !== 6) }], { profiles: false });
    expect(leftOut.epsilonK).toBeCloseTo(without.epsilonK, 8);
    expect(leftOut.sigmaAngstrom).toBeCloseTo(without.sigmaAngstrom, 8);
    expect(leftOut.chi2).toBeCloseTo(without.chi2, 8);
    expect(leftOut.dof).toBe(without.dof);
    expect(leftOut.residuals).toHaveLength(TEMPERATURES.length);
    const flagged = leftOut.residuals.filter((r) => r.excluded);
    expect(flagged.map((r) => r.rowNumber)).toEqual([2, 7]);
    for (const r of flagged)
      expect(r.predicted).toBeCloseTo(b2WithGradient(r.temperatureK, leftOut.epsilonK, leftOut.sigmaAngstrom).b2Cm3PerMol, 8);
    // χ² is the sum over the counted rows only.
    const counted = leftOut.residuals.filter((r) => !r.excluded).reduce((s, r) => s + r.residual ** 2, 0);
    expect(counted).toBeCloseTo(leftOut.chi2, 8);
    expect(leftOut.perMeasurementSet[0]).toMatchObject({ points: TEMPERATURES.length - 2, excludedPoints: 2 });
    expect(leftOut.perMeasurementSet[0].chi2).toBeCloseTo(leftOut.chi2, 8);
    // Without leaving them out, the two bad rows pull the fit away.
    const all = fitLennardJones([data], { profiles: false });
    expect(all.chi2).toBeGreaterThan(leftOut.chi2 + 100);
  });

  it('names a row that does not exist', () => {
    const call = () => fitLennardJones([{ ...data, excludeRows: [11] }], {});
    expect(call).toThrow(LjFitInputError);
    expect(call).toThrow('row 11 cannot be left out: the rows are numbered 1 to 10');
  });
});

describe('profile χ²', () => {
  it('on an exactly quadratic χ² gives best ± √(threshold·C_aa) with the other parameter re-optimised', () => {
    // χ²(a, b) = χ²min + [Δa Δb] C⁻¹ [Δa Δb]ᵀ; minimised over b, Δχ² = Δa²/C_aa (Press et al. 2007, §15.6.5, from memory).
    const C = [
      [4, 1.8],
      [1.8, 1],
    ];
    const det = C[0][0] * C[1][1] - C[0][1] * C[1][0];
    const inv = [
      [C[1][1] / det, -C[0][1] / det],
      [-C[1][0] / det, C[0][0] / det],
    ];
    const chi2 = (a: number, b: number) => 12 + inv[0][0] * (a - 5) ** 2 + 2 * inv[0][1] * (a - 5) * (b - 2) + inv[1][1] * (b - 2) ** 2;
    const curve = profileChi2({
      best: 5,
      standardError: 2,
      chi2Min: 12,
      threshold: 1.5,
      bounds: [-100, 100],
      othersAtBest: [2],
      chi2At: (a) => {
        const b = 2 - (inv[0][1] / inv[1][1]) * (a - 5);
        return { chi2: chi2(a, b), others: [b] };
      },
    });
    const half = Math.sqrt(1.5 * C[0][0]);
    expect(curve.lower!).toBeCloseTo(5 - half, 6);
    expect(curve.upper!).toBeCloseTo(5 + half, 6);
    curve.values.forEach((v, i) => expect(curve.deltaChi2[i]).toBeCloseTo((v - 5) ** 2 / C[0][0], 9));
  });

  it('on a nearly linear B2 fit agrees with the linearised ±1 standard error', () => {
    // Tight data make the model linear over the width of the interval; the threshold carries the χ²/ν scaling.
    const fit = fitLennardJones([measurementSet((b) => 0.002 + 0.0002 * Math.abs(b), 3)], {});
    for (const name of ['epsilonK', 'sigmaAngstrom'] as const) {
      const p = fit.profiles[name]!;
      const se = fit.stdErr[name]!;
      expect(p.threshold).toBeCloseTo(fit.reducedChi2!, 12);
      expect(Math.abs(p.lower! - (fit[name] - se)) / se).toBeLessThan(0.02);
      expect(Math.abs(p.upper! - (fit[name] + se)) / se).toBeLessThan(0.02);
      expect(p.values.length).toBe(13);
    }
  });

  it('on loose data the profile interval is asymmetric where the linearised one cannot be', () => {
    const fit = fitLennardJones([measurementSet((b) => 3 + 0.05 * Math.abs(b), 5)], {});
    const p = fit.profiles.epsilonK!;
    const below = fit.epsilonK - p.lower!;
    const above = p.upper! - fit.epsilonK;
    expect(Math.abs(below - above) / fit.stdErr.epsilonK!).toBeGreaterThan(0.02);
  });
});

describe('strong correlation and failed fits', () => {
  it('warns in plain words when |correlation(ε, σ)| exceeds 0.95', () => {
    // B2 alone constrains ε and σ along a narrow valley (correlation near −1; common practice, no source).
    const fit = fitLennardJones([measurementSet(() => 2)], { profiles: false });
    expect(Math.abs(fit.correlation!)).toBeGreaterThan(0.95);
    expect(fit.strongCorrelation).toBe(true);
    expect(fit.warnings.join(' ')).toMatch(/strongly correlated .* the data pin down a combination of the two/);
  });

  it('a fit that does not converge keeps its last iterate, marked not converged, with residuals and no standard errors', () => {
    const fit = fitLennardJones([measurementSet(() => 2)], { start: { epsilonK: 60, sigmaAngstrom: 5.5 }, restarts: 0, maxIterations: 5 });
    expect(fit.status).toBe('failed');
    expect(fit.converged).toBe(false);
    expect(Number.isFinite(fit.epsilonK) && Number.isFinite(fit.sigmaAngstrom)).toBe(true);
    expect(fit.stdErr).toEqual({ epsilonK: null, sigmaAngstrom: null });
    expect(fit.residuals).toHaveLength(TEMPERATURES.length);
    expect(fit.residuals.reduce((s, r) => s + r.residual ** 2, 0)).toBeCloseTo(fit.chi2, 6);
    expect(fit.profiles).toEqual({ epsilonK: null, sigmaAngstrom: null });
  });
});
