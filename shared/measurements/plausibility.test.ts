import { describe, expect, test } from 'vitest';
import { parseMeasurementCsv } from './parse-measurement-csv';
import { judgeValue, unitSlipHint } from './plausibility';

describe('plausibility of measured values', () => {
  test('hard limits refuse, usual limits warn, ordinary values pass', () => {
    expect(judgeValue('b2Cm3PerMol', -1e308, 'B2').verdict).toBe('refuse');
    expect(judgeValue('b2Cm3PerMol', -3e4, 'B2').verdict).toBe('warn');
    expect(judgeValue('b2Cm3PerMol', -150, 'B2').verdict).toBe('ok');
    // Mercury, the densest liquid, is about 13 500 kg/m³ (from memory): ordinary; 1e7 kg/m³ is not a fluid.
    expect(judgeValue('densityKgPerM3', 13534, 'density').verdict).toBe('ok');
    expect(judgeValue('densityKgPerM3', 1e7, 'density').verdict).toBe('refuse');
    expect(judgeValue('viscosityMicroPaS', 22.6, 'viscosity').verdict).toBe('ok');
  });

  test('a whole column off by 10⁶ is named as a unit slip; a column with some ordinary values is not', () => {
    expect(unitSlipHint('b2Cm3PerMol', [-2.1e8, -1.5e8], 'm3/mol')).toContain('a million times too large');
    expect(unitSlipHint('b2Cm3PerMol', [-3e4, -150], 'cm3/mol')).toBeNull();
  });

  test('the shared parser (also the upload preview) reports warnings without refusing the file', () => {
    const parsed = parseMeasurementCsv('T (K),B2 (m3/mol)\n250,-210\n300,-150\n', { kind: 'b2' });
    expect(parsed.ok).toBe(true);
    expect(parsed.rows).toHaveLength(2);
    expect(parsed.warnings.map((w) => w.code)).toEqual(['suspect-unit']);
    const refused = parseMeasurementCsv('T (K),B2 (cm3/mol)\n250,-1e308\n', { kind: 'b2' });
    expect(refused.ok).toBe(false);
    expect(refused.problems[0]).toMatchObject({ code: 'implausible-value', row: 2, column: 'B2 (cm3/mol)' });
  });
});
