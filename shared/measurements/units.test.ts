import { describe, expect, test } from 'vitest';
import { UnitConversionError, convertToCanonical, normaliseUnitText } from './units';
import { UNIT_CHECKS } from '../validation/checks/material-checks';
import { itPassesReferenceChecks } from '../validation/reference-check-tests';

/** Relative closeness, for factors that pass through floating-point arithmetic. */
function expectRel(actual: number, expected: number, rel = 1e-12) {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));
}

describe('conversion factors of NIST SP 811 (Thompson & Taylor, 2008), Appendix B.8 "Factors for units listed alphabetically" (from memory)', () => {
  test('bar → Pa = 1.0 E+05 (exact): 1 bar = 0.1 MPa', () => {
    expectRel(convertToCanonical(250, 'bar', 'pressure'), 25);
  });
  test('kilopascal and pascal: SI prefixes k = 1E+03, M = 1E+06 (SP 811 Table 5)', () => {
    expectRel(convertToCanonical(2e6, 'Pa', 'pressure'), 2);
  });
  test('centipoise (cP) → Pa·s = 1.0 E-03 (exact): 1 cP = 1000 µPa·s', () => {
    expectRel(convertToCanonical(0.0223, 'cP', 'viscosity'), 22.3);
  });
  test('poise (P) → Pa·s = 1.0 E-01 (exact); micropoise = 1E-07 Pa·s = 0.1 µPa·s', () => {
    expectRel(convertToCanonical(1, 'poise', 'viscosity'), 1e5);
    expectRel(convertToCanonical(223, 'micropoise', 'viscosity'), 22.3);
  });
  test('pascal second with prefixes: mPa·s = 1E-03 Pa·s, µPa·s canonical (SP 811 Table 5 prefixes)', () => {
    expectRel(convertToCanonical(2.23e-5, 'Pa*s', 'viscosity'), 22.3);
    expectRel(convertToCanonical(2.23e-5, 'Pa·s', 'viscosity'), 22.3);
    expectRel(convertToCanonical(22.3, 'uPa s', 'viscosity'), 22.3);
  });
  test('degree Celsius → kelvin: T/K = t/°C + 273.15 (SP 811 Sec. 4.2.1.1 and B.8)', () => {
    expectRel(convertToCanonical(0, '°C', 'temperature'), 273.15);
    expect(Math.abs(convertToCanonical(-273.15, '°C', 'temperature'))).toBeLessThan(1e-12);
  });
  test('a temperature difference in °C equals the same difference in K (SP 811 Sec. 4.2.1.1)', () => {
    expect(convertToCanonical(0.5, '°C', 'temperature', { difference: true })).toBeCloseTo(0.5, 12);
    expect(convertToCanonical(0.5, 'K', 'temperature', { difference: true })).toBe(0.5);
  });
  test('gram per cubic centimeter → kg/m³ = 1.0 E+03 (exact)', () => {
    expectRel(convertToCanonical(0.0016, 'g/cm3', 'density'), 1.6);
  });
  test('liter (L) → m³ = 1.0 E-03 (exact): 1 L/mol = 1000 cm³/mol; cubic centimeter → m³ = 1.0 E-06', () => {
    expectRel(convertToCanonical(-1.55e-5, 'm3/mol', 'b2'), -15.5);
    expectRel(convertToCanonical(-15.5, 'cm³/mol', 'b2'), -15.5);
  });
  // One conversion per factor (bar, atm, kPa, psi to 1e-6, cP, P, µP, mPa·s, °C, g/cm³, L/mol, mol/L of argon) is a
  // registry entry units.* (shared/validation/checks/material-checks.ts), run here and on the admin validation page.
  itPassesReferenceChecks(UNIT_CHECKS.filter((c) => c.testFile === 'shared/measurements/units.test.ts'));
});

describe('molar density with a molar mass', () => {
  // Argon, standard atomic weight 39.948(1) (IUPAC 2009: Wieser & Coplen, Pure Appl. Chem. 83 (2011) 359;
  // from memory). 1 mol/L = 1000 mol/m³, so ρ = 1000 mol/m³ × 0.039948 kg/mol = 39.948 kg/m³.
  test('mol/L → kg/m³ for argon', () => {
    expectRel(convertToCanonical(2.5, 'mol/dm3', 'density', { molarMassGPerMol: 39.948 }), 99.87);
  });
  test('mol/m³ → kg/m³ for argon, and its uncertainty', () => {
    expectRel(convertToCanonical(25, 'mol/m^3', 'density', { molarMassGPerMol: 39.948 }), 0.9987);
    expectRel(convertToCanonical(0.5, 'mol/m3', 'uDensity', { molarMassGPerMol: 39.948 }), 0.019974);
  });
  test('a clear error when the molar mass is missing or invalid', () => {
    expect(() => convertToCanonical(1, 'mol/L', 'density')).toThrow(/molar mass \(g\/mol\)/);
    try {
      convertToCanonical(1, 'mol/L', 'density');
    } catch (e) {
      expect(e).toBeInstanceOf(UnitConversionError);
      expect((e as UnitConversionError).code).toBe('missing-molar-mass');
    }
    expect(() => convertToCanonical(1, 'mol/L', 'density', { molarMassGPerMol: -4 })).toThrow(/positive number of g\/mol/);
  });
});

describe('spellings and errors (common practice, no source)', () => {
  test.each([
    ['cm3/mol', 'cm^3/mol'],
    ['kg m-3', 'kg m^-3'],
    ['kg·m⁻³', 'kg m^-3'],
    ['µPa·s', 'uPa s'],
    ['μPa s', 'uPa s'],
    ['uPa*s', 'uPa s'],
    ['mPa.s', 'mPa s'],
    ['mPas', 'mPa s'],
    ['° C', 'degC'],
    ['℃', 'degC'],
    ['ºC', 'degC'],
    ['deg C', 'degC'],
    ['Celsius', 'degC'],
    ['mol / L', 'mol/L'],
  ])('%s → %s', (input, expected) => {
    expect(normaliseUnitText(input)).toBe(expected);
  });
  test('µ (micro sign U+00B5) and μ (Greek mu U+03BC) give the same value', () => {
    expect(convertToCanonical(1, '\u00B5Pa s', 'viscosity')).toBe(convertToCanonical(1, '\u03BCPa s', 'viscosity'));
  });
  test('unknown units, numbers in units and wrong dimensions throw with a code and a message', () => {
    const codeOf = (f: () => unknown) => {
      try {
        f();
      } catch (e) {
        return [(e as UnitConversionError).code, (e as Error).message];
      }
      return undefined;
    };
    expect(codeOf(() => convertToCanonical(1, 'furlongs', 'temperature'))?.[0]).toBe('unknown-unit');
    expect(codeOf(() => convertToCanonical(1, '5 K', 'temperature'))?.[0]).toBe('unknown-unit');
    const wrong = codeOf(() => convertToCanonical(1, 'MPa', 'temperature'));
    expect(wrong?.[0]).toBe('wrong-dimension');
    expect(wrong?.[1]).toMatch(/"MPa" is a pressure unit, but temperature needs a temperature unit \(K, °C\)/);
    expect(codeOf(() => convertToCanonical(1, 'C', 'temperature'))?.[1]).toMatch(/For degrees Celsius write °C/);
    expect(codeOf(() => convertToCanonical(1, 'barg', 'pressure'))?.[0]).toBe('unknown-unit');
    expect(convertToCanonical(10, 'bara', 'pressure')).toBeCloseTo(1, 12);
    expect(codeOf(() => convertToCanonical(1, 'kg/m^3', 'b2'))?.[0]).toBe('wrong-dimension');
    expect(codeOf(() => convertToCanonical(1, 'mol/L', 'b2'))?.[0]).toBe('wrong-dimension');
    expect(codeOf(() => convertToCanonical(1, '', 'pressure'))?.[0]).toBe('missing-unit');
    expect(() => convertToCanonical(1, 'K', 'entropy')).toThrow(/Unknown quantity "entropy"/);
  });
});
