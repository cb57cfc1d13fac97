/** The shared zod schemas of shared/schemas/measurements.ts, as the server and the forms use them. */
import { describe, expect, test } from 'vitest';
import {
  apiRowSchemas,
  canonicalRowSchema,
  createSubstanceBody,
  measurementSetUploadFields,
  measurementSetVersionFields,
  updateSubstanceBody,
} from '../schemas/measurements';
import { parseMeasurementCsv } from './parse-measurement-csv';

describe('substance bodies', () => {
  test('create: name 1–120 characters, molar mass in g/mol with 1 ≤ M < 10000', () => {
    // Argon 39.948 g/mol (IUPAC 2009 standard atomic weight, from memory).
    expect(createSubstanceBody.parse({ name: ' Argon ', formula: 'Ar', molarMassGPerMol: 39.948 })).toEqual({
      name: 'Argon',
      formula: 'Ar',
      molarMassGPerMol: 39.948,
    });
    expect(createSubstanceBody.safeParse({ name: '', molarMassGPerMol: 39.948 }).success).toBe(false);
    expect(createSubstanceBody.safeParse({ name: 'x'.repeat(121), molarMassGPerMol: 39.948 }).success).toBe(false);
    expect(createSubstanceBody.safeParse({ name: 'x'.repeat(120), molarMassGPerMol: 39.948 }).success).toBe(true);
    // Below a hydrogen atom (1.008 g/mol, IUPAC standard atomic weight, from memory) nothing exists.
    for (const bad of [0, -1, 5e-324, 0.99, 10000, '39.948', Number.NaN]) {
      expect(createSubstanceBody.safeParse({ name: 'Argon', molarMassGPerMol: bad }).success).toBe(false);
    }
    const err = createSubstanceBody.safeParse({ name: 'Argon', molarMassGPerMol: 0 });
    expect(err.error?.issues[0].message).toMatch(/at least 1 g\/mol/);
    // Names are stored in NFKC with single spaces: a no-break space is a space.
    expect(createSubstanceBody.parse({ name: 'quillgas\u00a0\u00a0QG-1', molarMassGPerMol: 44 }).name).toBe('quillgas QG-1');
  });
  test('update: any subset, at least one field', () => {
    expect(updateSubstanceBody.parse({ molarMassGPerMol: 28.014 })).toEqual({ molarMassGPerMol: 28.014 });
    expect(updateSubstanceBody.parse({ formula: '' })).toEqual({ formula: '' });
    expect(updateSubstanceBody.safeParse({}).success).toBe(false);
    expect(updateSubstanceBody.safeParse({ name: '' }).success).toBe(false);
  });
});

describe('measurement set upload fields (multipart strings)', () => {
  const base = { substanceId: '3', kind: 'density', name: 'Isotherms 2026' };
  test('coerces ids and the default relative uncertainty, drops blank optional fields', () => {
    const f = measurementSetUploadFields.parse({ ...base, defaultRelativeUncertainty: '0.005', source: '', doi: '', mapping: '' });
    expect(f).toEqual({ substanceId: 3, kind: 'density', name: 'Isotherms 2026', defaultRelativeUncertainty: 0.005 });
  });
  test('defaultRelativeUncertainty must satisfy 0 < x ≤ 1', () => {
    for (const bad of ['0', '-0.1', '1.5', 'abc'])
      expect(measurementSetVersionFields.safeParse({ defaultRelativeUncertainty: bad }).success).toBe(false);
    expect(measurementSetVersionFields.parse({ defaultRelativeUncertainty: '1' }).defaultRelativeUncertainty).toBe(1);
  });
  test('DOI: pattern 10.<registrant>/<suffix> (DOI Handbook, sec. 2.2, from memory); resolver prefixes stripped', () => {
    expect(measurementSetVersionFields.parse({ doi: '10.1063/1.555555' }).doi).toBe('10.1063/1.555555');
    expect(measurementSetVersionFields.parse({ doi: 'https://doi.org/10.1021/je0000000' }).doi).toBe('10.1021/je0000000');
    expect(measurementSetVersionFields.parse({ doi: 'doi:10.1016/j.fluid.2020.112345' }).doi).toBe('10.1016/j.fluid.2020.112345');
    for (const bad of ['1063/1.555', '10.12/abc', '10.1063/', 'not a doi'])
      expect(measurementSetVersionFields.safeParse({ doi: bad }).success).toBe(false);
  });
  test('kind enum, delimiter and decimal names', () => {
    expect(measurementSetUploadFields.safeParse({ ...base, kind: 'enthalpy' }).success).toBe(false);
    expect(measurementSetVersionFields.parse({ delimiter: 'tab', decimal: 'comma' })).toEqual({ delimiter: '\t', decimal: ',' });
    expect(measurementSetVersionFields.parse({ delimiter: ';', decimal: '.' })).toEqual({ delimiter: ';', decimal: '.' });
    expect(measurementSetVersionFields.safeParse({ delimiter: '|' }).success).toBe(false);
  });
  test('mapping: a JSON string parsed and validated', () => {
    const mapping = '{"0":{"quantity":"temperature","unit":"degC"},"2":{"quantity":"ignore"}}';
    expect(measurementSetVersionFields.parse({ mapping }).mapping).toEqual({
      0: { quantity: 'temperature', unit: 'degC' },
      2: { quantity: 'ignore' },
    });
    const bad = measurementSetVersionFields.safeParse({ mapping: '{not json' });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0].message).toMatch(/mapping must be JSON/);
    expect(measurementSetVersionFields.safeParse({ mapping: '{"0":{"quantity":"entropy"}}' }).success).toBe(false);
    expect(measurementSetVersionFields.safeParse({ mapping: '{"a":{"quantity":"temperature"}}' }).success).toBe(false);
  });
});

describe('canonical row shapes', () => {
  test('rows from the parser satisfy the row schema; API rows omit the kind', () => {
    const r = parseMeasurementCsv('T (K),P (MPa),rho (kg/m3)\n300,1,16\n');
    expect(r.ok).toBe(true);
    for (const row of r.rows) expect(canonicalRowSchema.parse(row)).toEqual(row);
    const { kind: _kind, ...api } = r.rows[0];
    expect(apiRowSchemas.density.parse(api)).toEqual(api);
    expect(canonicalRowSchema.safeParse({ ...r.rows[0], densityKgPerM3: -1 }).success).toBe(false);
  });
});
