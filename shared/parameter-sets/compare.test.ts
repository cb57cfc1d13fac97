import { describe, expect, it } from 'vitest';
import { b2WithGradient } from '../physics/virial';
import { measurementSetDeviations } from './compare';

describe('measurementSetDeviations', () => {
  // Reference: the classical LJ reduced second virial coefficient B2* = B2/b0 at T* = 1 is −2.5381, and
  // b0 = (2/3)πN_Aσ³ (Hirschfelder, Curtiss & Bird 1954, Table I-B; values from memory).
  it('is zero for points generated from the same parameters and matches a hand computation otherwise', () => {
    const eps = 120;
    const sigma = 3.4;
    const temps = [120, 240, 360];
    const exact = temps.map((T) => ({
      measurementSetId: 7,
      kind: 'b2' as const,
      temperatureK: T,
      measured: b2WithGradient(T, eps, sigma).b2Cm3PerMol,
    }));
    const [same] = measurementSetDeviations(exact, eps, sigma, { quantumCorrection: false });
    expect(same).toMatchObject({ measurementSetId: 7, kind: 'b2', points: 3, skipped: 0 });
    expect(same.rms).toBeLessThan(1e-9);
    expect(same.aadPercent!).toBeLessThan(1e-9);

    // At T* = 1: b0 = (2/3)π·6.02214076e23·(3.4e-8 cm)³ = 49.48 cm³/mol, so B2 = −2.5381·49.48 ≈ −125.6 cm³/mol.
    const b0 = (2 / 3) * Math.PI * 6.02214076e23 * 3.4e-8 ** 3;
    expect(exact[0].measured).toBeCloseTo(-2.5381 * b0, 0);

    // Shift every measured value by +2 cm³/mol: RMS is 2, AAD is the mean of 2/|B2|.
    const shifted = exact.map((p) => ({ ...p, measured: p.measured + 2 }));
    const [d] = measurementSetDeviations(shifted, eps, sigma, { quantumCorrection: false });
    expect(d.rms).toBeCloseTo(2, 9);
    const expectedAad = shifted.reduce((s, p) => s + Math.abs((100 * -2) / p.measured), 0) / 3;
    expect(d.aadPercent!).toBeCloseTo(expectedAad, 9);
  });

  it('keeps sets apart and counts points the model cannot evaluate', () => {
    const pts = [
      { measurementSetId: 'a', kind: 'b2' as const, temperatureK: 300, measured: -10 },
      { measurementSetId: 'b', kind: 'viscosity' as const, temperatureK: 300, measured: 20 },
    ];
    // Viscosity needs the molar mass: without it, the point is skipped rather than invented.
    const out = measurementSetDeviations(pts, 120, 3.4, { quantumCorrection: false });
    expect(out.map((d) => [d.measurementSetId, d.points, d.skipped])).toEqual([
      ['a', 1, 0],
      ['b', 1, 1],
    ]);
    expect(Number.isNaN(out[1].rms)).toBe(true);
  });
});
