/**
 * CSV exports (RFC 4180: comma-separated, CRLF line ends, fields with comma, quote or line break enclosed
 * in double quotes and inner quotes doubled). One header row, then one row per parameter set (or per pair
 * for a mixture). Units are in the header names; the caution text is the last column because CSV has no
 * comments.
 *
 * Formula injection (OWASP, "CSV Injection"): a text cell that starts with =, +, -, @, tab or carriage
 * return is read as a formula by spreadsheet programs, so it gets a leading single quote. We also treat
 * U+2212 MINUS SIGN and the full-width ＝ ＋ － ＠ the same way (extra caution, no source).
 * Numbers stay numbers: a cell is left alone when it is a plain decimal number (optional leading "-",
 * digits, optional fraction and exponent), because a spreadsheet reads such a cell as that number and
 * nothing else. Numeric values are always written from numbers, so "-1.5" stays -1.5, while a name
 * "-1+2" or "=1" is escaped.
 */
import type { ExportableParameterSet, ExportOptions } from './exportable-parameter-set';
import type { EnergyUnit, LengthUnit } from '../physics/parameter-units';
import { convertEpsilon, convertSigma } from '../physics/parameter-units';
import { mixtureTable, COMBINING_RULE_INFO, type CombiningRule } from '../mixing/combining-rules';
import { CAUTION_TEXT, tidy, validityOf } from './export-common';

const FORMULA_START = /^[=+\-@\t\r\u2212\uFF1D\uFF0B\uFF0D\uFF20]/;
const PLAIN_NUMBER = /^-?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const NEEDS_QUOTES = /[",\r\n]/;

export type CsvValue = string | number | null | undefined;

/** True when a spreadsheet would read the text as a formula (and it is not a plain number). */
export function isFormulaLike(text: string): boolean {
  return FORMULA_START.test(text) && !PLAIN_NUMBER.test(text);
}

/** One field, escaped against formula injection first and then quoted per RFC 4180 §2 when needed. */
export function csvCell(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  let text: string;
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) return '';
    text = String(value);
  } else {
    text = isFormulaLike(value) ? `'${value}` : value;
  }
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvRow(values: readonly CsvValue[]): string {
  return values.map(csvCell).join(',');
}

/** Header + rows joined with CRLF and ending with one (RFC 4180 §2, rules 1 and 2). */
export function csvDocument(header: readonly string[], rows: readonly (readonly CsvValue[])[]): string {
  return [csvRow(header), ...rows.map(csvRow)].join('\r\n') + '\r\n';
}

const ENERGY_SUFFIX: Record<EnergyUnit, string> = { K: 'K', 'kJ/mol': 'kJ_per_mol', 'kcal/mol': 'kcal_per_mol', eV: 'eV' };
const LENGTH_SUFFIX: Record<LengthUnit, string> = { Å: 'Angstrom', nm: 'nm' };

function measurementSetsText(set: ExportableParameterSet): string {
  return set.measurementSets
    .map((d) => {
      const extra = [`id ${d.id}`, d.doi ? `doi ${d.doi}` : null, d.source ? `source ${d.source}` : null].filter(Boolean).join(', ');
      return `${d.kind}: ${d.name} v${d.version} (${extra})`;
    })
    .join('; ');
}

/**
 * One row per set. Always ε/k_B in K and σ in Å; `energyUnit`/`lengthUnit` add columns in that unit next
 * to them (nothing extra when they are K or Å).
 */
export function parameterSetsToCsv(sets: readonly ExportableParameterSet[], options: ExportOptions = {}): string {
  const eu = options.energyUnit && options.energyUnit !== 'K' ? options.energyUnit : null;
  const lu = options.lengthUnit && options.lengthUnit !== 'Å' ? options.lengthUnit : null;
  const header = [
    'parameter_set_id',
    'version',
    'state',
    'approved_at',
    'approved_by',
    'substance_id',
    'substance',
    'formula',
    'molar_mass_g_per_mol',
    'model',
    'repulsive_exponent',
    'epsilon_over_kB_K',
    'epsilon_stderr_K',
    ...(eu ? [`epsilon_${ENERGY_SUFFIX[eu]}`, `epsilon_stderr_${ENERGY_SUFFIX[eu]}`] : []),
    'sigma_Angstrom',
    'sigma_stderr_Angstrom',
    ...(lu ? [`sigma_${LENGTH_SUFFIX[lu]}`, `sigma_stderr_${LENGTH_SUFFIX[lu]}`] : []),
    'correlation_epsilon_sigma',
    'cutoff_scheme',
    'cutoff_rc_over_sigma',
    'cutoff_rc_Angstrom',
    'T_min_K',
    'T_max_K',
    'p_min_MPa',
    'p_max_MPa',
    'fit_id',
    'measurement_sets',
    'caution',
  ];
  const rows = sets.map((s) => {
    const uEps = s.stdErr.epsilonK;
    const uSig = s.stdErr.sigmaAngstrom;
    return [
      s.id,
      s.version,
      s.state,
      s.approvedAt,
      s.approvedBy,
      s.substance.id,
      s.substance.name,
      s.substance.formula ?? null,
      s.substance.molarMassGPerMol,
      s.model,
      s.repulsiveExponent ?? 12,
      s.epsilonK,
      uEps,
      ...(eu ? [tidy(convertEpsilon(s.epsilonK, eu)), uEps == null ? null : tidy(convertEpsilon(uEps, eu))] : []),
      s.sigmaAngstrom,
      uSig,
      ...(lu ? [tidy(convertSigma(s.sigmaAngstrom, lu)), uSig == null ? null : tidy(convertSigma(uSig, lu))] : []),
      s.correlation,
      s.scheme,
      s.cutoffSigma,
      s.cutoffSigma == null ? null : tidy(s.cutoffSigma * s.sigmaAngstrom),
      ...((v) => [v.temperatureMinK, v.temperatureMaxK, v.pressureMinMPa, v.pressureMaxMPa])(validityOf(s)),
      s.fitId,
      measurementSetsText(s),
      CAUTION_TEXT,
    ];
  });
  return csvDocument(header, rows);
}

/** One row per pair i ≤ j (1-based indices), with the rule and the "estimate, not fitted" note on every row. */
export function mixtureToCsv(sets: readonly ExportableParameterSet[], rule: CombiningRule, options: ExportOptions = {}): string {
  const table = mixtureTable(sets, rule);
  const eu = options.energyUnit && options.energyUnit !== 'K' ? options.energyUnit : null;
  const lu = options.lengthUnit && options.lengthUnit !== 'Å' ? options.lengthUnit : null;
  const header = [
    'i',
    'j',
    'parameter_set_i',
    'version_i',
    'parameter_set_j',
    'version_j',
    'substance_i',
    'substance_j',
    'kind',
    'combining_rule',
    'epsilon_over_kB_K',
    ...(eu ? [`epsilon_${ENERGY_SUFFIX[eu]}`] : []),
    'sigma_Angstrom',
    ...(lu ? [`sigma_${LENGTH_SUFFIX[lu]}`] : []),
    'note',
    'caution',
  ];
  const ruleName = COMBINING_RULE_INFO[rule].name;
  const rows = table.pairs.map((p) => {
    const a = sets[p.i];
    const b = sets[p.j];
    return [
      p.i + 1,
      p.j + 1,
      a.id,
      a.version,
      b.id,
      b.version,
      a.substance.name,
      b.substance.name,
      p.kind,
      p.kind === 'pure' ? null : p.fitted ? `pair set ${p.fitted.pairSetId} (k_ij = ${p.fitted.kij})` : ruleName,
      p.epsilonK,
      ...(eu ? [tidy(convertEpsilon(p.epsilonK, eu))] : []),
      p.sigmaAngstrom,
      ...(lu ? [tidy(convertSigma(p.sigmaAngstrom, lu))] : []),
      table.note,
      CAUTION_TEXT,
    ];
  });
  return csvDocument(header, rows);
}
