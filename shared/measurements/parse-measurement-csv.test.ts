/**
 * The upload parser on the CSV corpus in tests/fixtures/csv/: one small broken file per validation
 * case (code, row, column) and good files in several spellings. The good files hold invented round
 * numbers; expected canonical values follow from exact unit definitions (NIST SP 811, 2008,
 * Appendix B.8, from memory: °C + 273.15 = K, 1 bar = 0.1 MPa, 1 L = 1e-3 m³).
 * Row convention under test: 1-based line of the file, every line counted, header = row 1.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import { parseMeasurementCsv, type ParseOptions } from './parse-measurement-csv';
import { MAX_DATA_ROWS } from './problems';
import { suggestColumnMapping, templateHeaders } from './headers';
import { B2_DEFAULT_UNCERTAINTY_FLOOR_CM3_PER_MOL, type B2Row, type DensityRow, type ViscosityRow } from './property-kinds';

const fixture = (name: string) => readFileSync(new URL(`../../tests/fixtures/csv/${name}`, import.meta.url), 'utf8');

function expectClose(actual: number, expected: number, rel = 1e-12) {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.max(Math.abs(expected), 1e-300));
}

describe('broken files: one problem each, with code, row and column', () => {
  const cases: Array<{
    file: string;
    code: string;
    row?: number;
    column?: string;
    field?: string;
    message: RegExp;
    options?: ParseOptions;
  }> = [
    {
      file: 'non-numeric-cell.csv',
      code: 'non-numeric',
      row: 4,
      column: 'B2 (cm3/mol)',
      message: /Row 4, column "B2 \(cm3\/mol\)": "n\/a" is not a number/,
    },
    {
      file: 'missing-required-column.csv',
      code: 'missing-required-column',
      row: 1,
      field: 'pressureMPa',
      message: /No pressure column found .*"P \(MPa\)"/,
    },
    {
      file: 'unknown-unit.csv',
      code: 'unknown-unit',
      row: 1,
      column: 'eta (cSt)',
      message: /Column "eta \(cSt\)": Unknown unit "cSt"\..*dynamic viscosity/,
    },
    {
      file: 'wrong-dimension.csv',
      code: 'wrong-dimension',
      row: 1,
      column: 'P (kg/m3)',
      message: /Column "P \(kg\/m3\)": Unit "kg\/m3" is a mass density unit, but pressure needs a pressure unit/,
    },
    {
      file: 'nonpositive-temperature.csv',
      code: 'nonpositive-temperature',
      row: 4,
      column: 'T (°C)',
      message: /Row 4, column "T \(°C\)": temperature -300 °C = -26\.85 K is not positive/,
    },
    {
      file: 'nonpositive-pressure.csv',
      code: 'nonpositive-pressure',
      row: 3,
      column: 'P (MPa)',
      message: /Row 3, column "P \(MPa\)": pressure 0 MPa is not positive/,
    },
    {
      file: 'nonpositive-density.csv',
      code: 'nonpositive-density',
      row: 4,
      column: 'rho (kg/m3)',
      message: /Row 4, column "rho \(kg\/m3\)": density -48 kg\/m³ is not positive/,
    },
    {
      file: 'nonpositive-viscosity.csv',
      code: 'nonpositive-viscosity',
      row: 3,
      column: 'eta (uPa s)',
      message: /Row 3, column "eta \(uPa s\)": viscosity 0 µPa·s is not positive/,
    },
    {
      file: 'nonpositive-uncertainty.csv',
      code: 'nonpositive-uncertainty',
      row: 3,
      column: 'u(B2) (cm3/mol)',
      message: /Row 3, column "u\(B2\) \(cm3\/mol\)": uncertainty of B2 -0\.5 cm³\/mol is not positive/,
    },
    // Row 5 writes row 2's state point as 26,850 °C and 1,0E1 bar: equal after parsing and conversion.
    {
      file: 'duplicate-state-point.csv',
      code: 'duplicate-state-point',
      row: 5,
      column: 'T (°C)',
      message: /Row 5 \("T \(°C\)" = 26,850, "P \(bar\)" = 1,0E1\) repeats the state point of row 2 \(T = 300 K, P = 1 MPa\)/,
    },
    {
      file: 'missing-molar-mass.csv',
      code: 'missing-molar-mass',
      row: 1,
      column: 'rho (mol/L)',
      message: /molar density; converting it to kg\/m³ needs the substance's molar mass/,
    },
    { file: 'unknown-kind.csv', code: 'unknown-kind', row: 1, message: /Cannot tell which property .*"Temp", "Value", "Err"/ },
    { file: 'empty.csv', code: 'empty-file', message: /The file is empty/ },
    { file: 'header-only.csv', code: 'no-data-rows', message: /header line but no data rows/ },
  ];
  test.each(cases)('$file → $code', ({ file, code, row, column, field, message, options }) => {
    const r = parseMeasurementCsv(fixture(file), options);
    expect(r.ok).toBe(false);
    expect(r.rows).toEqual([]);
    expect(r.problems).toHaveLength(1);
    const p = r.problems[0];
    expect(p.code).toBe(code);
    expect(p.row).toBe(row);
    expect(p.column).toBe(column);
    if (field) expect(p.field).toBe(field);
    expect(p.message).toMatch(message);
    if (column) expect(p.message).toContain(`"${column}"`);
  });

  test('too many rows: generated, limit MAX_DATA_ROWS = 5000 by default and settable', () => {
    const lines = (n: number) =>
      ['T (K),eta (uPa s)', ...Array.from({ length: n }, (_, i) => `${100 + i * 0.1},${10 + i * 0.01}`)].join('\n');
    expect(MAX_DATA_ROWS).toBe(5000);
    const over = parseMeasurementCsv(lines(5001));
    expect(over.ok).toBe(false);
    expect(over.problems.map((p) => p.code)).toEqual(['too-many-rows']);
    expect(over.problems[0].message).toMatch(/5001 data rows; at most 5000/);
    const at = parseMeasurementCsv(lines(5000));
    expect(at.ok).toBe(true);
    expect(at.rows).toHaveLength(5000);
    expect(parseMeasurementCsv(lines(11), { maxRows: 10 }).problems[0].code).toBe('too-many-rows');
  });

  test('several problems in one file are all reported, in file order, and nothing partial is returned', () => {
    const r = parseMeasurementCsv('T (K),B2 (cm3/mol),u(B2) (cm3/mol)\n300,-15,0\n310,abc,1\n-5,3,\n320,,1\n330,1,1,9\n');
    expect(r.ok).toBe(false);
    expect(r.rows).toEqual([]);
    expect(r.problems.map((p) => [p.code, p.row])).toEqual([
      ['nonpositive-uncertainty', 2],
      ['non-numeric', 3],
      ['nonpositive-temperature', 4],
      ['missing-value', 5],
      ['extra-cells', 6],
    ]);
  });

  test('problems beyond MAX_PROBLEMS are summarised in one message', () => {
    const text = ['T (K),eta (uPa s)', ...Array.from({ length: 300 }, (_, i) => `${300 + i},x`)].join('\n');
    const r = parseMeasurementCsv(text);
    expect(r.problems).toHaveLength(201);
    expect(r.problems[200]).toMatchObject({ code: 'too-many-problems' });
    expect(r.problems[200].message).toMatch(/^100 more problem/);
  });

  test('a decimal comma in a comma-delimited, dot-decimal context is reported with a hint', () => {
    const r = parseMeasurementCsv('T (K);eta (uPa s)\n300;22.5\n400;"29,5"\n', { decimal: '.' });
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0]).toMatchObject({ code: 'non-numeric', row: 3, column: 'eta (uPa s)' });
    expect(r.problems[0].message).toMatch(/decimal comma/);
  });

  test('option validation: defaultRelativeUncertainty must satisfy 0 < x ≤ 1', () => {
    const text = fixture('good-b2-parentheses.csv');
    for (const bad of [0, -0.01, 1.5, Number.NaN]) {
      const r = parseMeasurementCsv(text, { defaultRelativeUncertainty: bad });
      expect(r.ok).toBe(false);
      expect(r.problems[0]).toMatchObject({ code: 'invalid-option', field: 'defaultRelativeUncertainty' });
    }
    expect(parseMeasurementCsv(text, { defaultRelativeUncertainty: 1 }).ok).toBe(true);
  });

  test('two columns for one quantity are reported at the second one', () => {
    const r = parseMeasurementCsv('T (K),eta (uPa s),viscosity (cP)\n300,22,0.022\n');
    expect(r.problems.map((p) => [p.code, p.row, p.column])).toEqual([['duplicate-column', 1, 'viscosity (cP)']]);
  });

  test('an empty required cell is a missing value; an empty uncertainty takes the default', () => {
    const r = parseMeasurementCsv('T (K),B2 (cm3/mol),u(B2) (cm3/mol)\n300,,1\n');
    expect(r.problems.map((p) => [p.code, p.row, p.column])).toEqual([['missing-value', 2, 'B2 (cm3/mol)']]);
    const mixed = parseMeasurementCsv('T (K),B2 (cm3/mol),u(B2) (cm3/mol)\n300,-15,0.4\n400,-100,\n', { defaultRelativeUncertainty: 0.02 });
    expect(mixed.ok).toBe(true);
    // 0.02 × max(|−100|, 10) = 2 cm³/mol.
    expect((mixed.rows as B2Row[]).map((x) => [x.uB2Cm3PerMol, x.uncertaintySource])).toEqual([
      [0.4, 'measured'],
      [2, 'default-relative'],
    ]);
  });

  test('a header without a unit is reported at the header row; a mapping can supply the unit', () => {
    const r = parseMeasurementCsv('T,eta (uPa s)\n300,22\n');
    expect(r.problems.map((p) => [p.code, p.row, p.column])).toEqual([['missing-unit', 1, 'T']]);
    expect(r.problems[0].message).toMatch(/No unit given for temperature.*"T \(K\)"/);
    const fixed = parseMeasurementCsv('T,eta (uPa s)\n300,22\n', { mapping: { 0: { quantity: 'temperature', unit: 'K' } } });
    expect(fixed.ok).toBe(true);
    // A mapping without a unit keeps the unit the header wrote: "Temperatur [°C]" is not a known name.
    const german = parseMeasurementCsv('Temperatur [°C],eta (uPa s)\n26.85,22\n', { mapping: { 0: { quantity: 'temperature' } } });
    expect(german.ok).toBe(true);
    expect(german.rows[0].temperatureK).toBeCloseTo(300, 10);
  });

  test('an invalid molar mass is an option problem', () => {
    const r = parseMeasurementCsv(fixture('good-density-molar.csv'), { molarMassGPerMol: 0 });
    expect(r.ok).toBe(false);
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0]).toMatchObject({ code: 'invalid-molar-mass', field: 'molarMassGPerMol' });
  });

  test('comment-only file counts as empty; mapping errors are reported', () => {
    expect(parseMeasurementCsv('# nothing here\n\n').problems[0].code).toBe('empty-file');
    const r = parseMeasurementCsv('T (K),eta (uPa s)\n300,22\n', { mapping: { 5: { quantity: 'temperature', unit: 'K' } } });
    expect(r.problems.map((p) => p.code)).toEqual(['invalid-mapping']);
    const r2 = parseMeasurementCsv('T (K),eta (uPa s)\n300,22\n', { mapping: { 1: { quantity: 'entropy' as never, unit: 'K' } } });
    expect(r2.problems[0]).toMatchObject({ code: 'invalid-mapping', column: 'eta (uPa s)' });
  });
});

describe('good files', () => {
  test('°C and bar density file with measured uncertainties (comment line above the header)', () => {
    const r = parseMeasurementCsv(fixture('good-density-celsius-bar.csv'));
    expect(r.problems).toEqual([]);
    expect(r.ok).toBe(true);
    expect(r.kind).toBe('density');
    expect(r.delimiter).toBe(',');
    expect(r.columns.map((c) => [c.header, c.quantity, c.unitText])).toEqual([
      ['T [°C]', 'temperature', '°C'],
      ['p (bar)', 'pressure', 'bar'],
      ['rho (kg/m3)', 'density', 'kg/m3'],
      ['u(rho) (kg/m3)', 'uDensity', 'kg/m3'],
    ]);
    const rows = r.rows as DensityRow[];
    expect(rows.map((x) => x.row)).toEqual([3, 4, 5, 6]);
    // 25 °C = 298.15 K, 75 °C = 348.15 K; 10 bar = 1 MPa, 50 bar = 5 MPa.
    const expected = [
      [298.15, 1, 16, 0.02],
      [298.15, 5, 80, 0.05],
      [348.15, 1, 14, 0.02],
      [348.15, 5, 70, 0.05],
    ];
    rows.forEach((x, i) => {
      expectClose(x.temperatureK, expected[i][0]);
      expectClose(x.pressureMPa, expected[i][1]);
      expectClose(x.densityKgPerM3, expected[i][2]);
      expectClose(x.uDensityKgPerM3, expected[i][3]);
      expect(x.uncertaintySource).toBe('measured');
    });
    expect(rows[0].raw).toEqual({ temperatureK: '25', pressureMPa: '10', densityKgPerM3: '16', uDensityKgPerM3: '0.02' });
  });

  test('semicolon-delimited file with decimal commas is detected', () => {
    const r = parseMeasurementCsv(fixture('good-viscosity-semicolon-decimal-comma.csv'));
    expect(r.problems).toEqual([]);
    expect([r.kind, r.delimiter, r.decimal]).toEqual(['viscosity', ';', ',']);
    const rows = r.rows as ViscosityRow[];
    expect(rows.map((x) => [x.temperatureK, x.viscosityMicroPaS, x.uViscosityMicroPaS])).toEqual([
      [250, 18.5, 0.05],
      [300, 22.5, 0.05],
      [350, 26, 0.1],
      [400, 29.5, 0.1],
    ]);
  });

  test('brackets and parentheses give the same rows', () => {
    const a = parseMeasurementCsv(fixture('good-b2-parentheses.csv'));
    const b = parseMeasurementCsv(fixture('good-b2-brackets.csv'));
    expect(a.ok && b.ok).toBe(true);
    expect(b.rows).toEqual(a.rows);
    expect((a.rows as B2Row[]).map((x) => x.b2Cm3PerMol)).toEqual([-50, -15, -1, 8]);
  });

  test('µ (micro sign), μ (Greek mu) and u prefixes give the same rows', () => {
    const names = ['good-viscosity-micro-sign.csv', 'good-viscosity-greek-mu.csv', 'good-viscosity-u-prefix.csv'];
    const [micro, greek, u] = names.map((n) => parseMeasurementCsv(fixture(n)));
    for (const r of [micro, greek, u]) expect(r.problems).toEqual([]);
    const values = (r: typeof micro) => (r.rows as ViscosityRow[]).map((x) => [x.temperatureK, x.viscosityMicroPaS]);
    expect(values(micro)).toEqual([
      [300, 22.5],
      [400, 29.5],
    ]);
    expect(values(greek)).toEqual(values(micro));
    expect(values(u)).toEqual(values(micro));
  });

  test('a file with unrecognised headers needs a mapping, and parses with one', () => {
    const text = fixture('good-needs-mapping.csv');
    const without = parseMeasurementCsv(text);
    expect(without.ok).toBe(false);
    expect(without.problems[0].code).toBe('unknown-kind');
    expect(without.unmappedColumns).toEqual([0, 1, 2]);
    const suggestion = suggestColumnMapping(['Temp_C', 'Virial', 'Err'], 'b2');
    expect(suggestion.unrecognisedColumns).toEqual([0, 1, 2]);
    expect(suggestion.missingRequired).toEqual(['temperature', 'b2']);

    const r = parseMeasurementCsv(text, {
      kind: 'b2',
      mapping: {
        0: { quantity: 'temperature', unit: 'degC' },
        1: { quantity: 'b2', unit: 'cm3/mol' },
        2: { quantity: 'uB2', unit: 'cm3/mol' },
      },
    });
    expect(r.problems).toEqual([]);
    const rows = r.rows as B2Row[];
    // 26.85 °C = 300 K, 126.85 °C = 400 K.
    expectClose(rows[0].temperatureK, 300);
    expectClose(rows[1].temperatureK, 400);
    expect(rows.map((x) => [x.b2Cm3PerMol, x.uB2Cm3PerMol, x.uncertaintySource])).toEqual([
      [-15, 0.5, 'measured'],
      [-1, 0.5, 'measured'],
    ]);
    expect(r.columns[0]).toMatchObject({ header: 'Temp_C', quantity: 'temperature', unitText: 'degC', canonicalUnit: 'K' });
  });

  test('a mapping can ignore a recognised column', () => {
    const r = parseMeasurementCsv('T (K),eta (uPa s),viscosity (cP)\n300,22,0.022\n', { mapping: { 2: { quantity: 'ignore' } } });
    expect(r.ok).toBe(true);
    expect(r.unmappedColumns).toEqual([2]);
  });

  test('tab-delimited file with comments and blank lines: rows keep their line numbers; default uncertainty with the B2 floor', () => {
    const r = parseMeasurementCsv(fixture('good-b2-tab-comments.csv'), { defaultRelativeUncertainty: 0.01 });
    expect(r.problems).toEqual([]);
    expect(r.delimiter).toBe('\t');
    const rows = r.rows as B2Row[];
    expect(rows.map((x) => x.row)).toEqual([5, 7, 9]);
    expect(B2_DEFAULT_UNCERTAINTY_FLOOR_CM3_PER_MOL).toBe(10);
    // u = 0.01 × max(|B2|, 10 cm³/mol): 0.15 for −15; 0.1 for −1 and 8.
    expect(rows.map((x) => [x.b2Cm3PerMol, x.uncertaintySource])).toEqual([
      [-15, 'default-relative'],
      [-1, 'default-relative'],
      [8, 'default-relative'],
    ]);
    expectClose(rows[0].uB2Cm3PerMol, 0.15);
    expectClose(rows[1].uB2Cm3PerMol, 0.1);
    expectClose(rows[2].uB2Cm3PerMol, 0.1);
  });

  test('molar density with the molar mass of argon (39.948 g/mol, IUPAC 2009 standard atomic weight, from memory)', () => {
    const r = parseMeasurementCsv(fixture('good-density-molar.csv'), { molarMassGPerMol: 39.948, defaultRelativeUncertainty: 0.002 });
    expect(r.problems).toEqual([]);
    const rows = r.rows as DensityRow[];
    // 0.4 mol/L = 400 mol/m³ × 0.039948 kg/mol = 15.9792 kg/m³; default u = 0.2 % of it.
    expectClose(rows[0].densityKgPerM3, 15.9792);
    expectClose(rows[1].densityKgPerM3, 31.9584);
    expectClose(rows[0].uDensityKgPerM3, 0.0319584);
    expect(rows[0].uncertaintySource).toBe('default-relative');
  });

  test('same temperature at different pressures is not a duplicate for density', () => {
    const r = parseMeasurementCsv('T (K),P (MPa),rho (kg/m3)\n300,1,16\n300,1.000001,16\n');
    expect(r.ok).toBe(true);
  });

  test('CRLF line endings, byte-order mark and quoted cells with line breaks keep line numbers', () => {
    const r = parseMeasurementCsv('\uFEFFT (K),eta (uPa s),note\r\n300,22,"two\r\nlines"\r\n400,x,\r\n');
    expect(r.problems.map((p) => [p.code, p.row])).toEqual([['non-numeric', 4]]);
    const ok = parseMeasurementCsv('\uFEFFT (K),eta (uPa s),note\r\n300,22,"two\r\nlines"\r\n400,29,\r\n');
    expect(ok.ok).toBe(true);
    expect(ok.rows.map((x) => x.row)).toEqual([2, 4]);
    expect(ok.unmappedColumns).toEqual([2]);
  });

  test('a file of another property than the one chosen is named as such', () => {
    const r = parseMeasurementCsv(fixture('good-b2-parentheses.csv'), { kind: 'viscosity' });
    expect(r.problems.map((p) => [p.code, p.row, p.column])).toEqual([
      ['kind-mismatch', 1, 'B2 (cm3/mol)'],
      ['missing-required-column', 1, undefined],
    ]);
    expect(r.problems[0].message).toMatch(
      /upload is for Dilute-gas shear viscosity η\(T\), but column "B2 \(cm3\/mol\)" holds second virial coefficient/,
    );
  });

  test('template headers parse back to their own kind in canonical units', () => {
    for (const kind of ['b2', 'density', 'viscosity'] as const) {
      const headers = templateHeaders(kind);
      const r = parseMeasurementCsv(`${headers.join(',')}\n${headers.map(() => '300').join(',')}\n`);
      expect(r.problems).toEqual([]);
      expect(r.kind).toBe(kind);
      expect(Object.values(r.rows[0]).filter((v) => v === 300).length).toBe(headers.length);
    }
    expect(templateHeaders('viscosity')).toEqual(['T (K)', 'eta (µPa·s)', 'u(eta) (µPa·s)']);
  });

  test('an explicit kind overrides inference; a file with two property columns needs one', () => {
    const text = 'T (K),B2 (cm3/mol),eta (uPa s)\n300,-15,22\n';
    expect(parseMeasurementCsv(text).problems[0].message).toMatch(/several properties \(b2, viscosity\)/);
    const r = parseMeasurementCsv(text, { kind: 'viscosity' });
    expect(r.ok).toBe(true);
    expect(r.unmappedColumns).toEqual([1]);
  });
});
