import { describe, expect, it } from 'vitest';
import { quantumB2 } from '../physics/quantum-b2';
import { fitLennardJones, type FitMeasurementSet } from './lj-fit';
import { quantumDiagnostics } from './quantum-diagnostics';

// Neon-like and helium-like LJ constants (Hirschfelder, Curtiss & Bird 1954, Table I-A, from memory).
const NE = { epsilonK: 35.6, sigmaAngstrom: 2.749, molarMass: 20.18 };
const HE = { epsilonK: 10.22, sigmaAngstrom: 2.556, molarMass: 4.0026 };

describe('quantum diagnostics of a fit', () => {
  it('warns that the expansion has broken down for a helium-like gas at 20 K', () => {
    const points = [15, 20, 30, 60].map((temperatureK) => ({ kind: 'b2', temperatureK, uncertainty: 0.5 }));
    const d = quantumDiagnostics(points, { epsilonK: HE.epsilonK, sigmaAngstrom: HE.sigmaAngstrom, covariance: null }, HE.molarMass, true);
    expect(d.deBoerParameter).toBeCloseTo(2.68, 2);
    expect(d.warnings.join(' ')).toMatch(/quantum expansion has broken down: at T = 15 K/);
  });

  it('reports nothing quantum for a heavy gas and no Λ* without B2 or viscosity data', () => {
    const argonLike = quantumDiagnostics(
      [{ kind: 'b2', temperatureK: 300, uncertainty: 1 }],
      { epsilonK: 119.8, sigmaAngstrom: 3.405, covariance: null },
      39.948,
      false,
    );
    expect(argonLike.warnings).toEqual([]);
    expect(
      quantumDiagnostics(
        [{ kind: 'density', temperatureK: 300, uncertainty: 1 }],
        { epsilonK: 119.8, sigmaAngstrom: 3.405, covariance: null },
        39.948,
        false,
      ).deBoerParameter,
    ).toBeNull();
  });

  it('flags a classical fit to neon-like B2 as biased and reports Λ* with its standard error', () => {
    // Synthetic data: Feynman–Hibbs B2 of the neon-like gas at 45–200 K with u = 0.2 cm³/mol.
    const data: FitMeasurementSet[] = [
      {
        id: 'ne',
        kind: 'b2',
        rows: [45, 60, 80, 110, 150, 200].map((t) => ({
          temperatureK: t,
          value: quantumB2(t, NE.epsilonK, NE.sigmaAngstrom, NE.molarMass).feynmanHibbsCm3PerMol,
          uncertainty: 0.2,
        })),
      },
    ];
    const classical = fitLennardJones(data, { molarMassGPerMol: NE.molarMass, profiles: false } as Parameters<typeof fitLennardJones>[1]);
    expect(classical.status).toBe('succeeded');
    expect(classical.deBoerParameter).toBeGreaterThan(0.55);
    expect(classical.deBoerParameter).toBeLessThan(0.65);
    expect(classical.deBoerParameterStdErr).toBeGreaterThan(0);
    expect(classical.warnings.join(' ')).toMatch(/classical fit is biased by quantum effects/);
    const corrected = fitLennardJones(data, { molarMassGPerMol: NE.molarMass, quantumCorrection: true, profiles: false } as Parameters<
      typeof fitLennardJones
    >[1]);
    expect(corrected.warnings.join(' ')).not.toMatch(/classical fit is biased/);
    // The corrected fit lands nearer the true ε than the classical one (the bias the warning names).
    expect(Math.abs(corrected.epsilonK - NE.epsilonK)).toBeLessThan(Math.abs(classical.epsilonK - NE.epsilonK));
  });
});
