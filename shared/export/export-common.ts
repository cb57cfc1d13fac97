/**
 * Pieces every export format shares: the caution text, input checks, file names, one-line comment text,
 * number formatting for engine input, and the validity/cutoff summaries of a mixture.
 */
import type { ExportableParameterSet } from './exportable-parameter-set';
import { roundValidityPressureMPa, roundValidityTemperatureK } from '../parameter-sets/validity';
import type { CombiningRule } from '../mixing/combining-rules';
import { CUTOFF_SCHEMES, type CutoffScheme } from '../physics/cutoff-schemes';

/** Carried verbatim by every export (JSON field, CSV column, comment in each engine fragment). */
export const CAUTION_TEXT =
  'Fitted model parameters, not validated property data for pressure, safety or process design; defer to local codes and licensed engineering practice.';

/**
 * Cutoff suggested when a set was fitted to the full potential (B2, dilute-gas viscosity) and is used in a
 * simulation that must truncate: long enough that the tail correction (which assumes g(r) = 1 beyond rc)
 * is small. Common practice, no source.
 */
export const FULL_POTENTIAL_SUGGESTED_CUTOFF_SIGMA = 5;

export const SCHEME_DESCRIPTION: Record<CutoffScheme, string> = {
  'full-potential': 'full potential (no cutoff in the fit)',
  'truncated-tail': 'truncated at rc with analytic long-range tail corrections',
  'truncated-shifted': 'truncated at rc and shifted to zero at rc, no tail corrections',
};

export type ExportErrorCode =
  'invalid-set' | 'unknown-format' | 'too-few-sets' | 'duplicate-set' | 'unknown-rule' | 'unknown-unit' | 'unsupported-potential';

/** True for a Mie λr-6 set (λr ≠ 12). */
export function isMie(set: Pick<ExportableParameterSet, 'repulsiveExponent'>): boolean {
  return set.repulsiveExponent !== undefined && set.repulsiveExponent !== 12;
}

/** "Lennard-Jones 12-6" or "Mie 16-6 (u = C eps [(sigma/r)^16 - (sigma/r)^6], C = …)". */
export function potentialText(set: Pick<ExportableParameterSet, 'repulsiveExponent'>): string {
  if (!isMie(set)) return 'Lennard-Jones 12-6';
  const n = set.repulsiveExponent as number;
  const c = (n / (n - 6)) * Math.pow(n / 6, 6 / (n - 6));
  return `Mie ${engineNumber(n, 6)}-6 (u = C epsilon [(sigma/r)^${engineNumber(n, 6)} - (sigma/r)^6], C = ${engineNumber(c, 8)})`;
}

/** Thrown for input the exporters refuse; `code` lets the server map it to a 400 answer. */
export class ExportError extends Error {
  readonly code: ExportErrorCode;
  constructor(code: ExportErrorCode, message: string) {
    super(message);
    this.name = 'ExportError';
    this.code = code;
  }
}

const positiveFinite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x) && x > 0;
const nullOrFinite = (x: unknown) => x === null || x === undefined || (typeof x === 'number' && Number.isFinite(x));

/** Refuse sets that would produce a wrong or unusable export rather than a silently odd one. */
export function assertExportable(set: ExportableParameterSet): void {
  const where = `parameter set ${String(set?.id)}`;
  const fail = (msg: string): never => {
    throw new ExportError('invalid-set', `${where}: ${msg}`);
  };
  if (!set || typeof set !== 'object') fail('missing');
  if (!Number.isInteger(set.id) || set.id <= 0) fail('id must be a positive integer');
  if (!Number.isInteger(set.version) || set.version <= 0) fail('version must be a positive integer');
  if (set.model !== 'lj-12-6' && set.model !== 'mie') fail(`model must be "lj-12-6" or "mie" (got "${String(set.model)}")`);
  const n = set.repulsiveExponent ?? 12;
  if (typeof n !== 'number' || !(n >= 8 && n <= 36))
    fail(`repulsiveExponent must be a number from 8 to 36 (got ${String(set.repulsiveExponent)})`);
  if ((set.model === 'mie') !== (n !== 12))
    fail(`model "${set.model}" does not match repulsiveExponent ${n} (LJ 12-6 exactly when it is 12)`);
  if (!positiveFinite(set.epsilonK)) fail('epsilonK must be a finite number above 0');
  if (!positiveFinite(set.sigmaAngstrom)) fail('sigmaAngstrom must be a finite number above 0');
  if (!set.substance || typeof set.substance.name !== 'string') fail('substance name is missing');
  if (!positiveFinite(set.substance.molarMassGPerMol)) fail('substance molarMassGPerMol must be a finite number above 0');
  if (!(CUTOFF_SCHEMES as readonly string[]).includes(set.scheme)) fail(`unknown cutoff scheme "${String(set.scheme)}"`);
  if (set.scheme === 'full-potential' && set.cutoffSigma != null) fail('the full potential has no cutoff; cutoffSigma must be null');
  if (set.scheme !== 'full-potential' && !positiveFinite(set.cutoffSigma)) fail(`a ${set.scheme} set needs cutoffSigma (rc/σ) above 0`);
  if (!nullOrFinite(set.stdErr?.epsilonK) || !nullOrFinite(set.stdErr?.sigmaAngstrom))
    fail('standard errors must be finite numbers or null');
  if (!nullOrFinite(set.correlation) || (set.correlation != null && Math.abs(set.correlation) > 1))
    fail('correlation must be null or within [-1, 1]');
  const v = set.validity;
  if (!v || !positiveFinite(v.temperatureMinK) || !positiveFinite(v.temperatureMaxK) || v.temperatureMinK >= v.temperatureMaxK) {
    fail('validity needs 0 < temperatureMinK < temperatureMaxK');
  }
  if ((v.pressureMinMPa == null) !== (v.pressureMaxMPa == null)) fail('give both pressure bounds or neither');
  if (
    v.pressureMinMPa != null &&
    v.pressureMaxMPa != null &&
    !(v.pressureMinMPa >= 0 && v.pressureMinMPa < v.pressureMaxMPa && Number.isFinite(v.pressureMaxMPa))
  ) {
    fail('validity needs 0 ≤ pressureMinMPa < pressureMaxMPa');
  }
  if (!Number.isInteger(set.fitId) || set.fitId <= 0) fail('fitId must be a positive integer');
  if (!Array.isArray(set.measurementSets)) fail('measurement sets must be a list');
}

/** Lower-case ASCII slug for file names: "Norrane (Nr2)" → "norrane-nr2". */
export function slug(text: string, maxLength = 40): string {
  const s = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, maxLength)
    .replace(/-+$/, '');
  return s || 'substance';
}

export function fileBaseName(set: ExportableParameterSet): string {
  return `epsigma-${slug(set.substance.name)}-ps${set.id}-v${set.version}`;
}

export function mixtureFileBaseName(sets: readonly ExportableParameterSet[], rule: CombiningRule): string {
  return `epsigma-mixture-${sets.map((s) => `ps${s.id}v${s.version}`).join('-')}-${rule}`;
}

/**
 * Free text (names, sources) made safe for a one-line comment in an engine input file: line breaks and
 * other control characters would end the comment and let the rest of the text run as commands.
 */
export function oneLine(text: string | null | undefined): string {
  if (text == null) return '';
  return (
    String(text)
      // eslint-disable-next-line no-control-regex -- matching control characters is the point: they must not reach the file
      .replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]+/g, ' ')
      .replace(/\s+/g, ' ')
      .trim()
  );
}

/** A number for engine input: 8 significant digits, plain notation in the usual range, no trailing zeros. */
export function engineNumber(x: number, digits = 8): string {
  if (!Number.isFinite(x)) throw new RangeError(`cannot write ${x} into an engine input file`);
  return String(Number(x.toPrecision(digits)));
}

export function substanceLabel(set: ExportableParameterSet): string {
  const name = oneLine(set.substance.name);
  const formula = oneLine(set.substance.formula);
  return formula && formula !== name ? `${name} (${formula})` : name;
}

export function approvalText(set: ExportableParameterSet): string {
  const state = set.state.toLowerCase();
  const approved = set.approvedAt ? `approved ${oneLine(set.approvedAt)}${set.approvedBy ? ` by ${oneLine(set.approvedBy)}` : ''}` : '';
  if (state === 'approved') return approved || 'approved (date not recorded)';
  if (state === 'superseded') return `SUPERSEDED by a newer version${approved ? ` (${approved})` : ''}`;
  if (state === 'retired') return `RETIRED${approved ? ` (was ${approved})` : ''}`;
  return `NOT APPROVED (state: ${oneLine(set.state)})`;
}

export interface ValidityRange {
  temperatureMinK: number;
  temperatureMaxK: number;
  pressureMinMPa: number | null;
  pressureMaxMPa: number | null;
}

/** The set's validity limits, rounded as where they are made (0.01 K, 0.001 MPa), so no binary artefact reaches a file. */
export function validityOf(set: ExportableParameterSet): ValidityRange {
  const p = (x: number | null | undefined) => (x == null ? null : roundValidityPressureMPa(x));
  return {
    temperatureMinK: roundValidityTemperatureK(set.validity.temperatureMinK),
    temperatureMaxK: roundValidityTemperatureK(set.validity.temperatureMaxK),
    pressureMinMPa: p(set.validity.pressureMinMPa),
    pressureMaxMPa: p(set.validity.pressureMaxMPa),
  };
}

export function validityText(v: ValidityRange): string {
  const t = `T = ${engineNumber(v.temperatureMinK, 6)}–${engineNumber(v.temperatureMaxK, 6)} K`;
  const p =
    v.pressureMinMPa != null && v.pressureMaxMPa != null
      ? `p = ${engineNumber(v.pressureMinMPa, 6)}–${engineNumber(v.pressureMaxMPa, 6)} MPa`
      : 'pressure range not stated';
  return `${t}; ${p}`;
}

/**
 * Where every component of a mixture is inside its own validity range: the intersection of the ranges.
 * Null when they do not overlap. A pressure bound counts only when every set states one.
 */
export function commonValidity(sets: readonly ExportableParameterSet[]): ValidityRange | null {
  const vs = sets.map(validityOf);
  const tMin = Math.max(...vs.map((v) => v.temperatureMinK));
  const tMax = Math.min(...vs.map((v) => v.temperatureMaxK));
  if (!(tMin < tMax)) return null;
  const allP = vs.every((v) => v.pressureMinMPa != null && v.pressureMaxMPa != null);
  if (!allP) return { temperatureMinK: tMin, temperatureMaxK: tMax, pressureMinMPa: null, pressureMaxMPa: null };
  const pMin = Math.max(...vs.map((v) => v.pressureMinMPa as number));
  const pMax = Math.min(...vs.map((v) => v.pressureMaxMPa as number));
  if (!(pMin < pMax)) return null;
  return { temperatureMinK: tMin, temperatureMaxK: tMax, pressureMinMPa: pMin, pressureMaxMPa: pMax };
}

export interface MixtureCutoff {
  /** The treatment the engine fragment uses for every pair. */
  scheme: CutoffScheme;
  /** rc/σ_ij used for every pair. */
  cutoffSigma: number;
  /** False when the sets were fitted for different schemes or cutoffs; the fragments then carry a warning. */
  consistent: boolean;
  warning: string | null;
}

/**
 * One cutoff treatment for a whole mixture. When all sets agree it is theirs; otherwise the sets cannot all
 * be honoured, and the full-potential treatment (long cutoff with tail corrections) is the closest common
 * ground because it is nearest to the untruncated potential every truncated set approximates.
 */
export function mixtureCutoff(sets: readonly ExportableParameterSet[]): MixtureCutoff {
  const first = sets[0];
  const same = sets.every((s) => s.scheme === first.scheme && (s.cutoffSigma ?? null) === (first.cutoffSigma ?? null));
  if (same) {
    return {
      scheme: first.scheme,
      cutoffSigma: first.scheme === 'full-potential' ? FULL_POTENTIAL_SUGGESTED_CUTOFF_SIGMA : (first.cutoffSigma as number),
      consistent: true,
      warning: null,
    };
  }
  const list = sets
    .map((s) => `set ${s.id}: ${s.scheme}${s.cutoffSigma != null ? ` rc = ${engineNumber(s.cutoffSigma, 6)} σ` : ''}`)
    .join(', ');
  return {
    scheme: 'full-potential',
    cutoffSigma: FULL_POTENTIAL_SUGGESTED_CUTOFF_SIGMA,
    consistent: false,
    warning: `WARNING: the components were fitted for different cutoff treatments (${list}); no single treatment matches all of them, so a long cutoff (${FULL_POTENTIAL_SUGGESTED_CUTOFF_SIGMA} σ_ij) with tail corrections is written here.`,
  };
}

/** ε/k_B and σ with their standard errors, for comment lines. */
export function parameterText(set: ExportableParameterSet): string {
  const eps =
    set.stdErr.epsilonK != null
      ? `${engineNumber(set.epsilonK, 8)} ± ${engineNumber(set.stdErr.epsilonK, 2)} K`
      : `${engineNumber(set.epsilonK, 8)} K`;
  const sig =
    set.stdErr.sigmaAngstrom != null
      ? `${engineNumber(set.sigmaAngstrom, 8)} ± ${engineNumber(set.stdErr.sigmaAngstrom, 2)} Å`
      : `${engineNumber(set.sigmaAngstrom, 8)} Å`;
  const unc = set.stdErr.epsilonK != null || set.stdErr.sigmaAngstrom != null ? ' (± one standard error)' : '';
  return `epsilon/k_B = ${eps}, sigma = ${sig}${unc}`;
}

/**
 * The comment block every engine fragment of one set starts with (without the comment character):
 * identity, approval, parameters, validity, fitted scheme, provenance and the caution text.
 */
export function setHeaderLines(set: ExportableParameterSet): string[] {
  const lines = [
    `Epsigma parameter set ${set.id} v${set.version}: ${substanceLabel(set)}, ${potentialText(set)}`,
    `Status: ${approvalText(set)}`,
    `Fit ${set.fitId}; ${parameterText(set)}`,
    `Valid for: ${validityText(validityOf(set))}`,
    `Fitted for: ${SCHEME_DESCRIPTION[set.scheme]}${set.cutoffSigma != null ? `, rc = ${engineNumber(set.cutoffSigma, 6)} sigma` : ''}`,
  ];
  for (const d of set.measurementSets) {
    const extra = [d.doi ? `doi ${oneLine(d.doi)}` : '', d.source ? oneLine(d.source) : ''].filter(Boolean).join('; ');
    lines.push(`Measurement set ${d.id} v${d.version} (${oneLine(d.kind)}): ${oneLine(d.name)}${extra ? ` [${extra}]` : ''}`);
  }
  lines.push(`CAUTION: ${CAUTION_TEXT}`);
  return lines;
}

/**
 * Text made safe for a whole-line comment in LAMMPS and GROMACS input: one line (see oneLine), no double
 * quotes (LAMMPS joins lines while a triple quote is open) and no trailing "&" or "\\" (LAMMPS and the
 * GROMACS preprocessor continue such a line onto the next, which would turn the next command into comment).
 */
export function commentSafe(text: string): string {
  return asciiText(oneLine(text))
    .replace(/"/g, "'")
    .replace(/[&\\\s]+$/, '');
}

const ASCII_FOR: Record<string, string> = {
  '\u2013': '-',
  '\u2014': '-',
  '\u2212': '-',
  '\u00b1': '+/-',
  '\u00c5': 'Angstrom',
  '\u212b': 'Angstrom',
  '\u2260': '!=',
  '\u2264': '<=',
  '\u2265': '>=',
  '\u03c3': 'sigma',
  '\u03b5': 'epsilon',
  '\u2019': "'",
  '\u2018': "'",
  '\u00b7': '*',
};

/** Our own symbols spelled in ASCII for engine input files (other text, such as names, is left as given). */
export function asciiText(text: string): string {
  return text.replace(/[\u2013\u2014\u2212\u00b1\u00c5\u212b\u2260\u2264\u2265\u03c3\u03b5\u2019\u2018\u00b7]/g, (c) => ASCII_FOR[c]);
}

/** A converted value without binary round-off noise in the last digits (12 significant digits). */
export function tidy(x: number): number {
  return Number(x.toPrecision(12));
}

/** Prefix each line with the engine's comment marker. */
export function commentBlock(marker: string, lines: readonly string[]): string[] {
  return lines.map((l) => {
    const safe = commentSafe(l);
    return safe ? `${marker} ${safe}` : marker;
  });
}
