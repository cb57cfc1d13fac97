/**
 * Header recognition. The header spellings are those a laboratory spreadsheet carries; the
 * quantity-calculus form "T/K" follows the IUPAC Green Book (Cohen et al., 2007, sec. 1.4, from
 * memory): a column heading is the quantity divided by its unit.
 */
import { describe, expect, test } from 'vitest';
import { inferKindFromHeaders, parseHeader, suggestColumnMapping } from './headers';
import { convertToCanonical } from './units';

describe('parseHeader', () => {
  test.each([
    ['T (K)', 'temperature', 'K'],
    ['T [°C]', 'temperature', '°C'],
    ['Temperature (degC)', 'temperature', 'degC'],
    ['TEMPERATURE [K]', 'temperature', 'K'],
    ['B2 (cm3/mol)', 'b2', 'cm3/mol'],
    ['u(B2) (cm3/mol)', 'uB2', 'cm3/mol'],
    ['u(B2)(cm3/mol)', 'uB2', 'cm3/mol'],
    ['P (MPa)', 'pressure', 'MPa'],
    ['p [bar]', 'pressure', 'bar'],
    ['rho (kg/m3)', 'density', 'kg/m3'],
    ['ρ [kg·m⁻³]', 'density', 'kg·m⁻³'],
    ['density (mol/L)', 'density', 'mol/L'],
    ['eta (uPa s)', 'viscosity', 'uPa s'],
    ['u(eta) (uPa*s)', 'uViscosity', 'uPa*s'],
    ['viscosity [µPa·s]', 'viscosity', 'µPa·s'],
    ['η (μPa s)', 'viscosity', 'μPa s'],
    ['Second virial coefficient (cm3/mol)', 'b2', 'cm3/mol'],
    ['T/K', 'temperature', 'K'],
    ['rho/(kg/m3)', 'density', 'kg/m3'],
    ['u(B2)/(cm3/mol)', 'uB2', 'cm3/mol'],
    ['Temperature in °C', 'temperature', '°C'],
    ['  p  ( kPa )  ', 'pressure', 'kPa'],
  ])('%s → %s in %s', (header, quantity, unit) => {
    const h = parseHeader(header);
    expect(h.quantity).toBe(quantity);
    expect(h.unitText).toBe(unit);
    expect(h.header).toBe(header);
  });

  test('every recognised unit spelling above converts (so recognition and conversion agree)', () => {
    expect(convertToCanonical(1, parseHeader('ρ [kg·m⁻³]').unitText!, 'density')).toBe(1);
    expect(convertToCanonical(1, parseHeader('viscosity [µPa·s]').unitText!, 'viscosity')).toBe(1);
    expect(convertToCanonical(1, parseHeader('u(eta) (uPa*s)').unitText!, 'uViscosity')).toBe(1);
  });

  test('a bare quantity name has no unit; a canonical field name implies its unit', () => {
    expect(parseHeader('u(B2)').quantity).toBe('uB2');
    expect(parseHeader('u(B2)').unitText).toBeUndefined();
    expect(parseHeader('T').quantity).toBe('temperature');
    expect(parseHeader('T').unitText).toBeUndefined();
    expect(parseHeader('temperatureK')).toMatchObject({ quantity: 'temperature', unitText: 'K', unitImplied: true });
    expect(parseHeader('b2Cm3PerMol')).toMatchObject({ quantity: 'b2', unitText: 'cm^3/mol' });
  });

  test('unrecognised headers keep their unit text for the mapping step', () => {
    expect(parseHeader('Temp_C')).toEqual({ header: 'Temp_C', name: 'Temp_C' });
    expect(parseHeader('Signal (mV)')).toEqual({ header: 'Signal (mV)', name: 'Signal', unitText: 'mV' });
  });
});

describe('inferKindFromHeaders', () => {
  test('the measured property decides; none or several give undefined', () => {
    expect(inferKindFromHeaders(['T (K)', 'B2 (cm3/mol)'])).toBe('b2');
    expect(inferKindFromHeaders(['T (K)', 'P (MPa)', 'rho (kg/m3)', 'u(rho) (kg/m3)'])).toBe('density');
    expect(inferKindFromHeaders(['T (K)', 'eta (uPa s)'])).toBe('viscosity');
    expect(inferKindFromHeaders(['T (K)', 'P (MPa)'])).toBeUndefined();
    expect(inferKindFromHeaders(['T (K)', 'B2 (cm3/mol)', 'eta (uPa s)'])).toBeUndefined();
    expect(inferKindFromHeaders([])).toBeUndefined();
  });
});

describe('suggestColumnMapping', () => {
  test('recognised columns with their units, unrecognised and unit-less ones listed', () => {
    expect(suggestColumnMapping(['T', 'P (bar)', 'rho (kg/m3)', 'comment', 'eta (uPa s)']).kind).toBeUndefined();
    expect(suggestColumnMapping(['T', 'P (bar)', 'rho (kg/m3)', 'comment']).kind).toBe('density');
    const s = suggestColumnMapping(['T', 'P (bar)', 'rho (kg/m3)', 'comment', 'eta (uPa s)'], 'density');
    expect(s.kind).toBe('density');
    expect(s.mapping).toEqual({
      0: { quantity: 'temperature', unit: 'K' },
      1: { quantity: 'pressure', unit: 'bar' },
      2: { quantity: 'density', unit: 'kg/m3' },
    });
    expect(s.missingUnitColumns).toEqual([0]);
    expect(s.unrecognisedColumns).toEqual([3, 4]);
    expect(s.missingRequired).toEqual([]);
  });
  test('a second column of the same quantity is left to the user', () => {
    const s = suggestColumnMapping(['T (K)', 'T (°C)', 'B2 (cm3/mol)']);
    expect(s.mapping[1]).toBeUndefined();
    expect(s.unrecognisedColumns).toEqual([1]);
  });
});
