/**
 * JSON exports in Epsigma's own versioned formats:
 *   "epsigma.parameter-set/1" — one parameter set,
 *   "epsigma.mixture/1"       — pure and cross pairs of several sets under one combining rule.
 * Every quantity carries its unit in the field name; the JSON Schemas are in json-schema.ts and
 * docs/export-formats.md describes each field. A new field or meaning means a new format version.
 */
import type { ExportableParameterSet } from './exportable-parameter-set';
import { COMBINING_RULE_INFO, mixtureTable, type CombiningRule, type PairKind } from '../mixing/combining-rules';
import { convertEpsilon, convertSigma } from '../physics/parameter-units';
import {
  CAUTION_TEXT,
  SCHEME_DESCRIPTION,
  tidy,
  commonValidity,
  isMie,
  mixtureCutoff,
  potentialText,
  validityOf,
  type ValidityRange,
} from './export-common';
import type { CutoffScheme } from '../physics/cutoff-schemes';

export const PARAMETER_SET_FORMAT_ID = 'epsigma.parameter-set/1';
export const MIXTURE_FORMAT_ID = 'epsigma.mixture/1';
export const LJ_POTENTIAL_FORM = 'u(r) = 4 epsilon [(sigma/r)^12 - (sigma/r)^6]';

export interface EnergyInAllUnits {
  epsilonK: number;
  epsilonKJPerMol: number;
  epsilonKcalPerMol: number;
  epsilonEV: number;
}

export interface LengthInAllUnits {
  sigmaAngstrom: number;
  sigmaNm: number;
}

export interface ParameterSetDocument {
  format: typeof PARAMETER_SET_FORMAT_ID;
  parameterSet: { id: number; version: number; state: string; approvedAt: string | null; approvedBy: string | null };
  substance: { id: number; name: string; formula: string | null; molarMassGPerMol: number };
  model: 'lj-12-6' | 'mie';
  /** λr: 12 for LJ 12-6. */
  repulsiveExponent: number;
  potentialForm: string;
  parameters: EnergyInAllUnits & LengthInAllUnits;
  uncertainties: {
    kind: 'standard-error';
    epsilonStdErrK: number | null;
    epsilonStdErrKJPerMol: number | null;
    epsilonStdErrKcalPerMol: number | null;
    epsilonStdErrEV: number | null;
    sigmaStdErrAngstrom: number | null;
    sigmaStdErrNm: number | null;
    correlationEpsilonSigma: number | null;
  };
  cutoff: { scheme: CutoffScheme; description: string; cutoffSigma: number | null; cutoffAngstrom: number | null; cutoffNm: number | null };
  validity: ValidityRange;
  provenance: {
    fitId: number;
    datasets: Array<{ id: number; version: number; kind: string; name: string; source: string | null; doi: string | null }>; // vocabulary: keep (export format v1)
  };
  caution: typeof CAUTION_TEXT;
}

export function energyInAllUnits(epsilonK: number): EnergyInAllUnits {
  return {
    epsilonK,
    epsilonKJPerMol: tidy(convertEpsilon(epsilonK, 'kJ/mol')),
    epsilonKcalPerMol: tidy(convertEpsilon(epsilonK, 'kcal/mol')),
    epsilonEV: tidy(convertEpsilon(epsilonK, 'eV')),
  };
}

export function lengthInAllUnits(sigmaAngstrom: number): LengthInAllUnits {
  return { sigmaAngstrom, sigmaNm: tidy(convertSigma(sigmaAngstrom, 'nm')) };
}

const orNull = <T>(x: T | null | undefined, f: (y: T) => number): number | null => (x == null ? null : f(x));

export function parameterSetDocument(set: ExportableParameterSet): ParameterSetDocument {
  const rcAngstrom = set.cutoffSigma == null ? null : tidy(set.cutoffSigma * set.sigmaAngstrom);
  return {
    format: PARAMETER_SET_FORMAT_ID,
    parameterSet: { id: set.id, version: set.version, state: set.state, approvedAt: set.approvedAt, approvedBy: set.approvedBy },
    substance: {
      id: set.substance.id,
      name: set.substance.name,
      formula: set.substance.formula ?? null,
      molarMassGPerMol: set.substance.molarMassGPerMol,
    },
    model: isMie(set) ? 'mie' : 'lj-12-6',
    repulsiveExponent: set.repulsiveExponent ?? 12,
    potentialForm: isMie(set) ? potentialText(set) : LJ_POTENTIAL_FORM,
    parameters: { ...energyInAllUnits(set.epsilonK), ...lengthInAllUnits(set.sigmaAngstrom) },
    uncertainties: {
      kind: 'standard-error',
      epsilonStdErrK: set.stdErr.epsilonK,
      epsilonStdErrKJPerMol: orNull(set.stdErr.epsilonK, (u) => tidy(convertEpsilon(u, 'kJ/mol'))),
      epsilonStdErrKcalPerMol: orNull(set.stdErr.epsilonK, (u) => tidy(convertEpsilon(u, 'kcal/mol'))),
      epsilonStdErrEV: orNull(set.stdErr.epsilonK, (u) => tidy(convertEpsilon(u, 'eV'))),
      sigmaStdErrAngstrom: set.stdErr.sigmaAngstrom,
      sigmaStdErrNm: orNull(set.stdErr.sigmaAngstrom, (u) => tidy(convertSigma(u, 'nm'))),
      correlationEpsilonSigma: set.correlation,
    },
    cutoff: {
      scheme: set.scheme,
      description: SCHEME_DESCRIPTION[set.scheme],
      cutoffSigma: set.cutoffSigma,
      cutoffAngstrom: rcAngstrom,
      cutoffNm: orNull(rcAngstrom, (r) => tidy(convertSigma(r, 'nm'))),
    },
    validity: validityOf(set),
    provenance: {
      fitId: set.fitId,
      // The published format v1 keeps its old provenance key (vocabulary: keep: "datasets"); a rename needs a format version 2.
      datasets: set.measurementSets.map((d) => ({
        id: d.id,
        version: d.version,
        kind: d.kind,
        name: d.name,
        source: d.source ?? null,
        doi: d.doi ?? null,
      })), // vocabulary: keep
    },
    caution: CAUTION_TEXT,
  };
}

export interface MixtureDocument {
  format: typeof MIXTURE_FORMAT_ID;
  combiningRule: { id: CombiningRule; name: string; formulas: string; reference: string };
  note: string;
  components: Array<{
    index: number;
    parameterSetId: number;
    version: number;
    state: string;
    approvedAt: string | null;
    substanceName: string;
    formula: string | null;
    molarMassGPerMol: number;
    epsilonK: number;
    sigmaAngstrom: number;
    scheme: CutoffScheme;
    cutoffSigma: number | null;
  }>;
  pairs: Array<
    { i: number; j: number; parameterSetIdI: number; parameterSetIdJ: number; kind: PairKind } & EnergyInAllUnits & LengthInAllUnits
  >;
  commonValidity: ValidityRange | null;
  cutoff: { scheme: CutoffScheme; cutoffSigma: number; consistent: boolean; warning: string | null };
  caution: typeof CAUTION_TEXT;
}

/** Component and pair indices are 1-based, as engine atom types are. */
export function mixtureDocument(sets: readonly ExportableParameterSet[], rule: CombiningRule): MixtureDocument {
  const table = mixtureTable(sets, rule);
  const info = COMBINING_RULE_INFO[rule];
  return {
    format: MIXTURE_FORMAT_ID,
    combiningRule: { id: info.id, name: info.name, formulas: info.formulas, reference: info.reference },
    note: table.note,
    components: sets.map((s, k) => ({
      index: k + 1,
      parameterSetId: s.id,
      version: s.version,
      state: s.state,
      approvedAt: s.approvedAt,
      substanceName: s.substance.name,
      formula: s.substance.formula ?? null,
      molarMassGPerMol: s.substance.molarMassGPerMol,
      epsilonK: s.epsilonK,
      sigmaAngstrom: s.sigmaAngstrom,
      scheme: s.scheme,
      cutoffSigma: s.cutoffSigma,
    })),
    pairs: table.pairs.map((p) => ({
      i: p.i + 1,
      j: p.j + 1,
      parameterSetIdI: sets[p.i].id,
      parameterSetIdJ: sets[p.j].id,
      kind: p.kind,
      ...energyInAllUnits(p.epsilonK),
      ...lengthInAllUnits(p.sigmaAngstrom),
    })),
    commonValidity: commonValidity(sets),
    cutoff: (({ scheme, cutoffSigma, consistent, warning }) => ({ scheme, cutoffSigma, consistent, warning }))(mixtureCutoff(sets)),
    caution: CAUTION_TEXT,
  };
}

export function parameterSetJsonText(set: ExportableParameterSet): string {
  return JSON.stringify(parameterSetDocument(set), null, 2) + '\n';
}

export function mixtureJsonText(sets: readonly ExportableParameterSet[], rule: CombiningRule): string {
  return JSON.stringify(mixtureDocument(sets, rule), null, 2) + '\n';
}
