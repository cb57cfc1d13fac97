import type { Selectable } from 'kysely';
import { measurementSetRefs, type MeasurementSetRef } from '../../../shared/contracts/measurement-set-ref';
import type {
  ParameterSetComment,
  ParameterSetDetail,
  ParameterSetSummary,
  ParameterSetValues,
} from '../../../shared/contracts/parameter-set';
import { STATE_LABELS, type Move } from '../../../shared/parameter-sets/transitions';
import { CUTOFF_SCHEME_LABELS, type CutoffScheme } from '../../../shared/physics/cutoff-schemes';
import { potentialLabel } from '../../../shared/physics/mie-potential';
import { readStoredJson } from '../../../shared/schemas/old-names';
import type { commentsOf, historyOf, ParameterSetRow } from './parameter-sets.repository';
import type { ParameterSetTable } from './parameter-sets.table';

/** The columns every view of a set reads (a parameter-set row, a catalog row), with the substance's name. */
export type ParameterSetValueColumns = Pick<
  Selectable<ParameterSetTable>,
  | 'id'
  | 'substanceId'
  | 'version'
  | 'scheme'
  | 'cutoffSigma'
  | 'model'
  | 'potential'
  | 'repulsiveExponent'
  | 'state'
  | 'epsilonK'
  | 'sigmaAngstrom'
  | 'epsilonStdErrK'
  | 'sigmaStdErrAngstrom'
  | 'correlation'
  | 'temperatureMinK'
  | 'temperatureMaxK'
  | 'pressureMinMpa'
  | 'pressureMaxMpa'
  | 'fitId'
> & { substanceName: string };

/** The stored measurement set versions behind a set (measurement_sets_json), parsed with their contract. */
export const readMeasurementSetRefs = (json: string): MeasurementSetRef[] => measurementSetRefs.parse(readStoredJson(json));

export function setLabel(row: {
  substanceName: string;
  version: number;
  scheme: CutoffScheme;
  cutoffSigma: number | null;
  repulsiveExponent?: number;
}): string {
  const cutoff = row.cutoffSigma === null ? '' : `, r_c = ${row.cutoffSigma} σ`;
  const potential = row.repulsiveExponent !== undefined && row.repulsiveExponent !== 12 ? `, ${potentialLabel(row.repulsiveExponent)}` : '';
  return `${row.substanceName} v${row.version} (${CUTOFF_SCHEME_LABELS[row.scheme]}${cutoff}${potential})`;
}

/** The one place a set's columns become API names (shared/contracts/parameter-set.ts): pressureMinMpa → validity.pressureMinMPa. */
export const toParameterSetValuesView = (row: ParameterSetValueColumns): ParameterSetValues => ({
  id: row.id,
  substanceId: row.substanceId,
  substanceName: row.substanceName,
  version: row.version,
  scheme: row.scheme,
  cutoffSigma: row.cutoffSigma,
  model: row.model,
  potential: row.potential,
  repulsiveExponent: row.repulsiveExponent,
  potentialLabel: potentialLabel(row.repulsiveExponent),
  state: row.state,
  stateLabel: STATE_LABELS[row.state],
  epsilonK: row.epsilonK,
  sigmaAngstrom: row.sigmaAngstrom,
  stdErr: { epsilonK: row.epsilonStdErrK, sigmaAngstrom: row.sigmaStdErrAngstrom },
  correlation: row.correlation,
  validity: {
    temperatureMinK: row.temperatureMinK,
    temperatureMaxK: row.temperatureMaxK,
    pressureMinMPa: row.pressureMinMpa,
    pressureMaxMPa: row.pressureMaxMpa,
  },
  fitId: row.fitId,
});

/** A parameter set as every list shows it. */
export const toParameterSetView = (row: ParameterSetRow): ParameterSetSummary => ({
  ...toParameterSetValuesView(row),
  label: setLabel(row),
  fitNumber: row.fitNumber,
  revisionOf: row.revisionOf,
  revisedBy: row.revisedBy ?? null,
  createdBy: row.createdBy,
  createdByName: row.createdByName,
  createdAt: row.createdAt,
  updatedAt: row.updatedAt,
});

export const toParameterSetCommentView = (c: Awaited<ReturnType<typeof commentsOf>>[number]): ParameterSetComment => ({
  id: c.id,
  authorId: c.authorId,
  authorName: c.authorName,
  body: c.body,
  createdAt: c.createdAt,
});

type TransitionRow = Awaited<ReturnType<typeof historyOf>>[number];
const toTransitionView = (h: TransitionRow): ParameterSetDetail['history'][number] => ({
  id: h.id,
  move: h.move,
  fromState: h.fromState,
  toState: h.toState,
  actorId: h.actorId,
  // A move with no actor was made by Epsigma itself (a supersede).
  actorName: h.actorName ?? (h.actorId ? null : 'Epsigma'),
  comment: h.comment,
  at: h.at,
});

type VersionSource = { id: number; source: string | null; doi: string | null; method: string | null; rowCount: number; sha256: string };

/** A stored reference with the source of its version (null when the version is gone from the read). */
export function toParameterSetMeasurementSetView(
  r: MeasurementSetRef,
  v: Partial<VersionSource> | undefined,
): ParameterSetDetail['measurementSets'][number] {
  return {
    measurementSetId: r.measurementSetId,
    name: r.name,
    kind: r.kind,
    version: r.version,
    versionId: r.versionId,
    weight: r.weight,
    source: v?.source ?? null,
    doi: v?.doi ?? null,
    method: v?.method ?? null,
    rowCount: v?.rowCount ?? null,
    sha256: v?.sha256 ?? null,
  };
}

/** GET /api/parameter-sets/:id from its parts: the row, its history and comments, its fit (as the fit view), its data's sources. */
export function toParameterSetDetailView(parts: {
  row: ParameterSetRow;
  fit: ParameterSetDetail['fit'];
  versions: VersionSource[];
  history: TransitionRow[];
  comments: Awaited<ReturnType<typeof commentsOf>>;
  currentApproved: ParameterSetRow | null;
  allowedMoves: Move[];
  canComment: boolean;
}): ParameterSetDetail {
  const { row } = parts;
  return {
    ...toParameterSetView(row),
    rationale: row.rationale,
    fit: parts.fit,
    measurementSets: readMeasurementSetRefs(row.measurementSetsJson).map((r) =>
      toParameterSetMeasurementSetView(
        r,
        parts.versions.find((x) => x.id === r.versionId),
      ),
    ),
    history: parts.history.map(toTransitionView),
    comments: parts.comments.map(toParameterSetCommentView),
    currentApproved: parts.currentApproved ? toParameterSetView(parts.currentApproved) : null,
    allowedMoves: parts.allowedMoves,
    canComment: parts.canComment,
  };
}
