import { describe, expect, it } from 'vitest';
import {
  EXPORT_FORMATS,
  exportMixture,
  exportOptionsFromQuery,
  exportParameterSet,
  isExportFormat,
  type ExportFormat,
} from './parameter-set-export';
import { ExportError } from './export-common';
import { checkJsonSchema } from './json-schema-check';
import { MIXTURE_JSON_SCHEMA, PARAMETER_SET_JSON_SCHEMA } from './json-schema';
import { brindleShifted, oskaneShifted, tarrowFull } from './export-test-sets';
import type { CombiningRule } from '../mixing/combining-rules';

const CAUTION =
  'Fitted model parameters, not validated property data for pressure, safety or process design; defer to local codes and licensed engineering practice.';

function expectExportError(fn: () => unknown, code: string, message: string) {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(ExportError);
    expect((e as ExportError).code).toBe(code);
    expect((e as Error).message).toBe(message);
    return;
  }
  throw new Error('expected an ExportError');
}

describe('exportParameterSet', () => {
  it('gives content type, file name and body for every format, each carrying the caution text', () => {
    const expected: Record<ExportFormat, [string, string]> = {
      json: ['application/json; charset=utf-8', 'epsigma-brindle-gas-ps12-v3.json'],
      csv: ['text/csv; charset=utf-8; header=present', 'epsigma-brindle-gas-ps12-v3.csv'],
      'lammps-real': ['text/plain; charset=utf-8', 'epsigma-brindle-gas-ps12-v3.lammps-real.in'],
      'lammps-metal': ['text/plain; charset=utf-8', 'epsigma-brindle-gas-ps12-v3.lammps-metal.in'],
      'lammps-lj': ['text/plain; charset=utf-8', 'epsigma-brindle-gas-ps12-v3.lammps-lj.in'],
      gromacs: ['text/plain; charset=utf-8', 'epsigma-brindle-gas-ps12-v3.gromacs.itp'],
    };
    for (const format of EXPORT_FORMATS) {
      const r = exportParameterSet(brindleShifted, format);
      expect([r.contentType, r.filename], format).toEqual(expected[format]);
      expect(r.body, format).toContain(CAUTION);
    }
    expect(checkJsonSchema(PARAMETER_SET_JSON_SCHEMA, JSON.parse(exportParameterSet(tarrowFull, 'json').body))).toEqual([]);
  });

  it('uses the unit options for CSV only', () => {
    expect(exportParameterSet(brindleShifted, 'csv', { energyUnit: 'eV' }).body.split('\r\n')[0]).toContain('epsilon_eV');
    expect(exportParameterSet(brindleShifted, 'json', { energyUnit: 'eV' }).body).toBe(exportParameterSet(brindleShifted, 'json').body);
    expect(exportParameterSet(brindleShifted, 'gromacs', { lengthUnit: 'Å' }).body).toBe(
      exportParameterSet(brindleShifted, 'gromacs').body,
    );
  });

  it('makes file names from ASCII slugs of the substance name', () => {
    const odd = { ...brindleShifted, substance: { ...brindleShifted.substance, name: 'Äthan/../"x"' } };
    expect(exportParameterSet(odd, 'json').filename).toBe('epsigma-athan-x-ps12-v3.json');
  });

  it('refuses unknown formats and sets that would give a wrong export', () => {
    expect(isExportFormat('pdf')).toBe(false);
    expectExportError(
      () => exportParameterSet(brindleShifted, 'pdf' as ExportFormat),
      'unknown-format',
      'unknown export format "pdf"; use one of json, csv, lammps-real, lammps-metal, lammps-lj, gromacs',
    );
    expectExportError(
      () => exportParameterSet({ ...brindleShifted, epsilonK: Number.NaN }, 'json'),
      'invalid-set',
      'parameter set 12: epsilonK must be a finite number above 0',
    );
    expectExportError(
      () => exportParameterSet({ ...brindleShifted, cutoffSigma: null }, 'csv'),
      'invalid-set',
      'parameter set 12: a truncated-shifted set needs cutoffSigma (rc/σ) above 0',
    );
    expectExportError(
      () => exportParameterSet({ ...tarrowFull, cutoffSigma: 2.5 }, 'gromacs'),
      'invalid-set',
      'parameter set 21: the full potential has no cutoff; cutoffSigma must be null',
    );
    expectExportError(
      () => exportParameterSet({ ...brindleShifted, validity: { temperatureMinK: 300, temperatureMaxK: 90 } }, 'json'),
      'invalid-set',
      'parameter set 12: validity needs 0 < temperatureMinK < temperatureMaxK',
    );
    expectExportError(
      () => exportParameterSet({ ...brindleShifted, validity: { temperatureMinK: 90, temperatureMaxK: 300, pressureMinMPa: 1 } }, 'json'),
      'invalid-set',
      'parameter set 12: give both pressure bounds or neither',
    );
    expectExportError(
      () => exportParameterSet({ ...brindleShifted, correlation: 1.5 }, 'json'),
      'invalid-set',
      'parameter set 12: correlation must be null or within [-1, 1]',
    );
    expectExportError(
      () => exportParameterSet({ ...brindleShifted, substance: { ...brindleShifted.substance, molarMassGPerMol: 0 } }, 'lammps-real'),
      'invalid-set',
      'parameter set 12: substance molarMassGPerMol must be a finite number above 0',
    );
  });
});

describe('exportMixture', () => {
  it('exports every format with the rule in the file name', () => {
    for (const format of EXPORT_FORMATS) {
      const r = exportMixture([brindleShifted, oskaneShifted], 'kong', format);
      expect(r.filename.startsWith('epsigma-mixture-ps12v3-ps16v1-kong')).toBe(true);
      expect(r.body).toContain(CAUTION);
      expect(r.body).toContain('not fitted');
    }
    expect(
      checkJsonSchema(
        MIXTURE_JSON_SCHEMA,
        JSON.parse(exportMixture([brindleShifted, oskaneShifted, tarrowFull], 'lorentz-berthelot', 'json').body),
      ),
    ).toEqual([]);
  });

  it('refuses fewer than two sets, a set twice, an unknown rule or an invalid set', () => {
    expectExportError(() => exportMixture([brindleShifted], 'kong', 'json'), 'too-few-sets', 'a mixture needs at least two parameter sets');
    expectExportError(
      () => exportMixture([brindleShifted, brindleShifted], 'kong', 'json'),
      'duplicate-set',
      'parameter set 12 appears twice in the mixture',
    );
    expectExportError(
      () => exportMixture([brindleShifted, oskaneShifted], 'mean' as CombiningRule, 'csv'),
      'unknown-rule',
      'unknown combining rule "mean"; use one of lorentz-berthelot, kong, waldman-hagler',
    );
    expectExportError(
      () => exportMixture([brindleShifted, { ...oskaneShifted, sigmaAngstrom: -3 }], 'kong', 'csv'),
      'invalid-set',
      'parameter set 16: sigmaAngstrom must be a finite number above 0',
    );
  });
});

describe('exportOptionsFromQuery (the units= query value)', () => {
  it('reads at most one energy and one length unit in any order', () => {
    expect(exportOptionsFromQuery(undefined)).toEqual({});
    expect(exportOptionsFromQuery('')).toEqual({});
    expect(exportOptionsFromQuery('kJ/mol,nm')).toEqual({ energyUnit: 'kJ/mol', lengthUnit: 'nm' });
    expect(exportOptionsFromQuery(' nm , eV ')).toEqual({ energyUnit: 'eV', lengthUnit: 'nm' });
    expect(exportOptionsFromQuery('kcal/mol,A')).toEqual({ energyUnit: 'kcal/mol', lengthUnit: 'Å' });
    expect(exportOptionsFromQuery('Å')).toEqual({ lengthUnit: 'Å' });
  });

  it('refuses unknown units and a second unit of the same kind', () => {
    expectExportError(
      () => exportOptionsFromQuery('J'),
      'unknown-unit',
      'units: "J" is not a unit we export in, or repeats a kind; give at most one of K, kJ/mol, kcal/mol, eV and one of Å, nm (A for Å)',
    );
    expectExportError(
      () => exportOptionsFromQuery('eV,K'),
      'unknown-unit',
      'units: "K" is not a unit we export in, or repeats a kind; give at most one of K, kJ/mol, kcal/mol, eV and one of Å, nm (A for Å)',
    );
  });
});
