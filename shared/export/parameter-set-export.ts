/**
 * Exports of approved parameter sets and of mixtures built from them. The lead maps database rows to
 * `ExportableParameterSet`; everything here is pure (no Node-only APIs) so the server routes
 * (GET /api/parameter-sets/:id/export, GET /api/mixtures) and the browser share it.
 */
import { isEnergyUnit, isLengthUnit, ENERGY_UNITS, LENGTH_UNITS } from '../physics/parameter-units';
import { COMBINING_RULES, isCombiningRule, type CombiningRule } from '../mixing/combining-rules';
import { parameterSetJsonText, mixtureJsonText } from './json-export';
import { parameterSetsToCsv, mixtureToCsv } from './csv-export';
import { lammpsLjMixture, lammpsLjParameterSet, lammpsParameterSet, lammpsMixture } from './lammps-export';
import { gromacsParameterSet, gromacsMixture } from './gromacs-export';
import { assertExportable, fileBaseName, isMie, mixtureFileBaseName, ExportError } from './export-common';
import type { ExportableParameterSet, ExportOptions } from './exportable-parameter-set';

export type { ExportableParameterSet, ExportOptions };

export const EXPORT_FORMATS = ['json', 'csv', 'lammps-real', 'lammps-metal', 'lammps-lj', 'gromacs'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

export function isExportFormat(value: unknown): value is ExportFormat {
  return typeof value === 'string' && (EXPORT_FORMATS as readonly string[]).includes(value);
}

/** Spellings of Å that survive URLs and keyboards without the letter. */
const ANGSTROM_ALIASES = new Set(['A', 'Angstrom', 'angstrom', 'Å', '\u212b']);

/**
 * The `units=` query value of the export routes: comma-separated, at most one energy and one length unit,
 * e.g. "kJ/mol,nm", "eV" or "kcal/mol,A". Empty or missing gives no options.
 */
export function exportOptionsFromQuery(units: string | null | undefined): ExportOptions {
  const options: ExportOptions = {};
  if (units == null || units.trim() === '') return options;
  for (const raw of units.split(',')) {
    const token = raw.trim();
    const unit = ANGSTROM_ALIASES.has(token) ? 'Å' : token;
    if (isEnergyUnit(unit) && options.energyUnit === undefined) options.energyUnit = unit;
    else if (isLengthUnit(unit) && options.lengthUnit === undefined) options.lengthUnit = unit;
    else {
      throw new ExportError(
        'unknown-unit',
        `units: "${token}" is not a unit we export in, or repeats a kind; give at most one of ${ENERGY_UNITS.join(', ')} and one of ${LENGTH_UNITS.join(', ')} (A for Å)`,
      );
    }
  }
  return options;
}

export interface ExportResult {
  contentType: string;
  filename: string;
  body: string;
}

const CONTENT_TYPE: Record<ExportFormat, string> = {
  json: 'application/json; charset=utf-8',
  // RFC 4180 §3 registers the optional "header" parameter of text/csv.
  csv: 'text/csv; charset=utf-8; header=present',
  'lammps-real': 'text/plain; charset=utf-8',
  'lammps-metal': 'text/plain; charset=utf-8',
  'lammps-lj': 'text/plain; charset=utf-8',
  gromacs: 'text/plain; charset=utf-8',
};

const EXTENSION: Record<ExportFormat, string> = {
  json: '.json',
  csv: '.csv',
  'lammps-real': '.lammps-real.in',
  'lammps-metal': '.lammps-metal.in',
  'lammps-lj': '.lammps-lj.in',
  gromacs: '.gromacs.itp',
};

function checkFormat(format: unknown): asserts format is ExportFormat {
  if (!isExportFormat(format))
    throw new ExportError('unknown-format', `unknown export format "${String(format)}"; use one of ${EXPORT_FORMATS.join(', ')}`);
}

/** One parameter set as a downloadable document. */
export function exportParameterSet(set: ExportableParameterSet, format: ExportFormat, options: ExportOptions = {}): ExportResult {
  checkFormat(format);
  assertExportable(set);
  if (isMie(set) && format === 'gromacs') {
    throw new ExportError(
      'unsupported-potential',
      `GROMACS has no Mie ${set.repulsiveExponent}-6 pair function (its non-bonded types are LJ 12-6 and Buckingham), and a tabulated potential needs table files and settings outside a topology fragment, so this set is not exported for GROMACS; use lammps-real, lammps-metal or lammps-lj (pair_style mie/cut), json or csv`,
    );
  }
  const filename = fileBaseName(set) + EXTENSION[format];
  let body: string;
  switch (format) {
    case 'json':
      body = parameterSetJsonText(set);
      break;
    case 'csv':
      body = parameterSetsToCsv([set], options);
      break;
    case 'lammps-real':
      body = lammpsParameterSet(set, 'real');
      break;
    case 'lammps-metal':
      body = lammpsParameterSet(set, 'metal');
      break;
    case 'lammps-lj':
      body = lammpsLjParameterSet(set);
      break;
    case 'gromacs':
      body = gromacsParameterSet(set);
      break;
  }
  return { contentType: CONTENT_TYPE[format], filename, body };
}

/** A mixture of several sets: pure pairs from the sets, cross pairs from the combining rule. */
export function exportMixture(
  sets: readonly ExportableParameterSet[],
  rule: CombiningRule,
  format: ExportFormat,
  options: ExportOptions = {},
): ExportResult {
  checkFormat(format);
  if (!isCombiningRule(rule))
    throw new ExportError('unknown-rule', `unknown combining rule "${String(rule)}"; use one of ${COMBINING_RULES.join(', ')}`);
  if (!Array.isArray(sets) || sets.length < 2) throw new ExportError('too-few-sets', 'a mixture needs at least two parameter sets');
  const mie = sets.find(isMie);
  if (mie)
    throw new ExportError(
      'unsupported-potential',
      `parameter set ${mie.id} is a Mie ${mie.repulsiveExponent}-6 set; mixtures are built from LJ 12-6 sets only (the combining rules here are for 12-6 parameters)`,
    );
  const ids = new Set<number>();
  for (const s of sets) {
    assertExportable(s);
    if (ids.has(s.id)) throw new ExportError('duplicate-set', `parameter set ${s.id} appears twice in the mixture`);
    ids.add(s.id);
  }
  const filename = mixtureFileBaseName(sets, rule) + EXTENSION[format];
  let body: string;
  switch (format) {
    case 'json':
      body = mixtureJsonText(sets, rule);
      break;
    case 'csv':
      body = mixtureToCsv(sets, rule, options);
      break;
    case 'lammps-real':
      body = lammpsMixture(sets, rule, 'real');
      break;
    case 'lammps-metal':
      body = lammpsMixture(sets, rule, 'metal');
      break;
    case 'lammps-lj':
      body = lammpsLjMixture(sets, rule);
      break;
    case 'gromacs':
      body = gromacsMixture(sets, rule);
      break;
  }
  return { contentType: CONTENT_TYPE[format], filename, body };
}
