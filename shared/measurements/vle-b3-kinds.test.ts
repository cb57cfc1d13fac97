/**
 * The upload kinds added for B3 and vapour–liquid equilibrium: unit-aware headers, conversion to the canonical
 * units (cm⁶/mol², kg/m³, MPa) and kind inference. Values are invented round numbers; the expected canonical values
 * follow from exact unit definitions (1 kPa = 1e-3 MPa, 1 L = 1e-3 m³; NIST SP 811, 2008, Appendix B.8, from memory).
 */
import { describe, expect, it } from 'vitest';
import { parseMeasurementCsv } from './parse-measurement-csv';
import { templateHeaders } from './headers';
import type { B3Row, SaturatedLiquidDensityRow, SaturatedVapourDensityRow, VapourPressureRow } from './property-kinds';

const VLE = [
  'T (K), rho_liq (kg/m3), u(rho_liq) (kg/m3), rho_vap (kg/m3), u(rho_vap) (kg/m3), p_sat (kPa), u(p_sat) (kPa)',
  '120, 1200, 2, 8.5, 0.1, 250, 1.5',
  '130, 1150, 2, 14, 0.2, 480, 2.5',
].join('\n');

describe('B3 and saturation kinds', () => {
  it('reads a saturated liquid density table and infers the kind', () => {
    const r = parseMeasurementCsv('T (K), rho_liq (kg/m3), u(rho_liq) (kg/m3)\n120, 1200, 2\n130, 1150, 2\n');
    expect(r.ok).toBe(true);
    expect(r.kind).toBe('saturatedLiquidDensity');
    const row = r.rows[0] as SaturatedLiquidDensityRow;
    expect(row.liquidDensityKgPerM3).toBe(1200);
    expect(row.uLiquidDensityKgPerM3).toBe(2);
  });

  it('reads one property of a three-column VLE table when the kind is chosen, in canonical units', () => {
    const p = parseMeasurementCsv(VLE, { kind: 'vapourPressure' });
    expect(p.ok).toBe(true);
    const pr = p.rows[1] as VapourPressureRow;
    expect(pr.vapourPressureMPa).toBeCloseTo(0.48, 12);
    expect(pr.uVapourPressureMPa).toBeCloseTo(0.0025, 12);
    const v = parseMeasurementCsv(VLE, { kind: 'saturatedVapourDensity' });
    expect((v.rows[0] as SaturatedVapourDensityRow).vapourDensityKgPerM3).toBe(8.5);
    // Without a kind the file is ambiguous and the message lists what it found.
    const none = parseMeasurementCsv(VLE);
    expect(none.ok).toBe(false);
    expect(none.problems[0].message).toMatch(/several properties \(saturatedLiquidDensity, saturatedVapourDensity, vapourPressure\)/);
  });

  it('converts molar densities with the molar mass', () => {
    const r = parseMeasurementCsv('T (K), rho_vap (mol/L)\n120, 0.5\n', { molarMassGPerMol: 40 });
    expect((r.rows[0] as SaturatedVapourDensityRow).vapourDensityKgPerM3).toBeCloseTo(20, 12);
  });

  it('reads B3 in cm6/mol2 and L2/mol2, and refuses a molar volume unit for it', () => {
    const a = parseMeasurementCsv('T (K), B3 (cm6/mol2), u(B3) (cm6/mol2)\n300, 1500, 100\n400, 1300, 100\n');
    expect(a.kind).toBe('b3');
    expect((a.rows[0] as B3Row).b3Cm6PerMol2).toBe(1500);
    const b = parseMeasurementCsv('T (K), B3 (L2/mol2)\n300, 0.0015\n');
    expect((b.rows[0] as B3Row).b3Cm6PerMol2).toBeCloseTo(1500, 9);
    // Default uncertainty keeps a floor where B3 crosses zero: 1 % of max(|B3|, 1000 cm⁶/mol²).
    expect((b.rows[0] as B3Row).uB3Cm6PerMol2).toBeCloseTo(15, 9);
    const wrong = parseMeasurementCsv('T (K), B3 (cm3/mol)\n300, 1500\n');
    expect(wrong.ok).toBe(false);
    expect(wrong.problems[0].message).toMatch(/molar volume unit, but third virial coefficient B3 needs a squared molar volume unit/);
  });

  it('offers template headers with units', () => {
    expect(templateHeaders('vapourPressure')).toEqual(['T (K)', 'p_sat (MPa)', 'u(p_sat) (MPa)']);
    expect(templateHeaders('b3')).toEqual(['T (K)', 'B3 (cm⁶/mol²)', 'u(B3) (cm⁶/mol²)']);
  });
});
