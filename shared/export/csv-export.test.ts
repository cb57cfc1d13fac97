import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { csvCell, csvDocument, isFormulaLike, mixtureToCsv, parameterSetsToCsv } from './csv-export';
import { brindleShifted, oskaneShifted, oskaneTail, tarrowFull } from './export-test-sets';
import { combine } from '../mixing/combining-rules';

const CAUTION =
  'Fitted model parameters, not validated property data for pressure, safety or process design; defer to local codes and licensed engineering practice.';

/** Parse with papaparse, an independent RFC 4180 reader, so quoting is checked by someone else's code. */
function parse(text: string): string[][] {
  const result = Papa.parse<string[]>(text, { newline: '\r\n', skipEmptyLines: true });
  expect(result.errors).toEqual([]);
  return result.data;
}

describe('csvCell: formula injection (OWASP "CSV Injection")', () => {
  // Trigger characters from the OWASP page: = + - @ tab carriage return; plus U+2212 and full-width forms.
  it.each([
    ['=1+1', "'=1+1"],
    ['+41 55 123', "'+41 55 123"],
    ['-2+3', "'-2+3"],
    ['@SUM(A1:A2)', "'@SUM(A1:A2)"],
    ['\tcmd', "'\tcmd"],
    ['\u22125', "'\u22125"],
    ['\uFF1D1+1', "'\uFF1D1+1"],
  ])('escapes %j', (input, expected) => {
    expect(csvCell(input)).toBe(expected);
  });

  it('quotes an escaped cell that also holds a delimiter, quote or line break (RFC 4180 §2 rules 6 and 7)', () => {
    // The DDE payload shape shown on the OWASP page (from memory).
    expect(csvCell("=cmd|' /C calc'!A0")).toBe("'=cmd|' /C calc'!A0");
    expect(csvCell('=HYPERLINK("http://example.invalid/?x=1","click")')).toBe('"\'=HYPERLINK(""http://example.invalid/?x=1"",""click"")"');
    expect(csvCell('\rsecond')).toBe('"\'\rsecond"');
  });

  it('leaves plain numbers alone, negative ones included, whether given as number or text', () => {
    expect(csvCell(-0.82)).toBe('-0.82');
    expect(csvCell(-1.5e-7)).toBe('-1.5e-7');
    expect(csvCell('-12.5')).toBe('-12.5');
    expect(csvCell('-.5E+3')).toBe('-.5E+3');
    expect(isFormulaLike('-12.5')).toBe(false);
    expect(isFormulaLike('-12.5.1')).toBe(true);
    expect(isFormulaLike('- 12')).toBe(true);
  });

  it('quotes per RFC 4180 without escaping harmless text; empty for null and non-finite numbers', () => {
    expect(csvCell('Norrane')).toBe('Norrane');
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\nlines')).toBe('"two\nlines"');
    expect(csvCell('x=1')).toBe('x=1');
    expect(csvCell(null)).toBe('');
    expect(csvCell(Number.NaN)).toBe('');
  });

  it('writes CRLF line ends and a final CRLF (RFC 4180 §2 rules 1 and 2)', () => {
    expect(csvDocument(['a', 'b'], [[1, 'x']])).toBe('a,b\r\n1,x\r\n');
  });
});

describe('parameter set CSV', () => {
  it('one header row and one row per set, units in the header, caution in the last column', () => {
    const rows = parse(parameterSetsToCsv([brindleShifted, oskaneTail, tarrowFull]));
    expect(rows).toHaveLength(4);
    const [header, brindle] = rows;
    expect(header).toContain('epsilon_over_kB_K');
    expect(header).toContain('sigma_Angstrom');
    expect(header).toContain('T_min_K');
    expect(header).toContain('p_max_MPa');
    expect(header.at(-1)).toBe('caution');
    const get = (name: string) => brindle[header.indexOf(name)];
    expect(get('parameter_set_id')).toBe('12');
    expect(get('version')).toBe('3');
    expect(get('approved_at')).toBe('2026-11-30T10:00:00Z');
    expect(get('epsilon_over_kB_K')).toBe('127.5');
    expect(get('correlation_epsilon_sigma')).toBe('-0.82');
    expect(get('cutoff_rc_Angstrom')).toBe('8.55');
    expect(get('measurement_sets')).toBe(
      'b2: Brindle gas B2, Quillmoor cell A v2 (id 4, source Quillmoor lab notebook 3); viscosity: Brindle gas dilute-gas viscosity v1 (id 5, doi 10.0000/quillmoor.example.5)',
    );
    expect(get('caution')).toBe(CAUTION);
    // Missing values are empty cells, not "null".
    const tarrow = rows[3];
    expect(tarrow[header.indexOf('cutoff_rc_over_sigma')]).toBe('');
    expect(tarrow[header.indexOf('p_min_MPa')]).toBe('');
  });

  it('escapes a substance name that starts with "=" and a reviewer name that starts with "@"', () => {
    const evil = {
      ...brindleShifted,
      substance: { ...brindleShifted.substance, name: '=HYPERLINK("http://example.invalid","x")' },
      approvedBy: '@admin',
    };
    const text = parameterSetsToCsv([evil]);
    const [header, row] = parse(text);
    expect(row[header.indexOf('substance')]).toBe('\'=HYPERLINK("http://example.invalid","x")');
    expect(row[header.indexOf('approved_by')]).toBe("'@admin");
    // No cell of the file starts with a trigger character.
    for (const cell of row) expect(isFormulaLike(cell), cell).toBe(false);
  });

  it('adds columns in the requested units next to the canonical ones', () => {
    const [header, row] = parse(parameterSetsToCsv([brindleShifted], { energyUnit: 'kcal/mol', lengthUnit: 'nm' }));
    // ε in kcal/mol = ε/k_B · R / 4184 with R = 8.314462618 J/(mol K) (CODATA 2018).
    expect(Number(row[header.indexOf('epsilon_kcal_per_mol')])).toBeCloseTo((127.5 * 8.314462618) / 4184, 10);
    expect(row[header.indexOf('sigma_nm')]).toBe('0.342');
    expect(row[header.indexOf('sigma_stderr_nm')]).toBe('0.0003');
    expect(header).not.toContain('epsilon_K');
    expect(parse(parameterSetsToCsv([brindleShifted], { energyUnit: 'K', lengthUnit: 'Å' }))[0]).toEqual(
      parse(parameterSetsToCsv([brindleShifted]))[0],
    );
  });
});

describe('mixture CSV', () => {
  it('one row per pair with kind, rule and the estimate note', () => {
    const rows = parse(mixtureToCsv([brindleShifted, oskaneShifted], 'lorentz-berthelot', { energyUnit: 'kJ/mol' }));
    expect(rows).toHaveLength(4);
    const [header, , cross] = rows;
    const get = (row: string[], name: string) => row[header.indexOf(name)];
    expect(rows.slice(1).map((r) => `${get(r, 'i')}-${get(r, 'j')}:${get(r, 'kind')}`)).toEqual([
      '1-1:pure',
      '1-2:combining-rule-estimate',
      '2-2:pure',
    ]);
    expect(get(cross, 'combining_rule')).toBe('Lorentz–Berthelot');
    const lb = combine('lorentz-berthelot', brindleShifted, oskaneShifted);
    expect(Number(get(cross, 'epsilon_over_kB_K'))).toBe(lb.epsilonK);
    expect(Number(get(cross, 'epsilon_kJ_per_mol'))).toBeCloseTo((lb.epsilonK * 8.314462618) / 1000, 10);
    expect(get(cross, 'note')).toContain('not fitted');
    expect(get(cross, 'caution')).toBe(CAUTION);
  });
});
