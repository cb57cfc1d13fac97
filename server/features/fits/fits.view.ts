import { fitResultSchema, type FitResult } from '../../../shared/contracts/fit-result';
import { storedFitOptions, type FitListItem, type FitView } from '../../../shared/contracts/fit';
import { measurementSetRefs } from '../../../shared/contracts/measurement-set-ref';
import { valueUnitOf } from '../../../shared/measurements/property-kinds';
import { readStoredJson } from '../../../shared/schemas/old-names';
import type { FitListRow, FitRow } from './fits.repository';

/** Stored JSON of a fit, parsed with its contracts after readStoredJson (rows written before the rename hold old keys). */
const readResult = (json: string | null): FitResult | null => (json ? fitResultSchema.parse(readStoredJson(json)) : null);
const readRefs = (json: string) => measurementSetRefs.parse(readStoredJson(json));

/** The fit record says succeeded only when the computation ran and the least squares converged to an answer. */
const fitStatus = (jobStatus: FitView['status'], result: FitResult | null) =>
  jobStatus === 'succeeded' && result?.status === 'failed' ? 'failed' : jobStatus;

/** The one place a fit row becomes its API view (shared/contracts/fit.ts). */
export function toFitView(row: FitRow): FitView {
  const result = readResult(row.resultJson);
  return {
    id: row.id,
    number: row.number,
    substanceId: row.substanceId,
    substanceName: row.substanceName,
    model: row.model,
    status: fitStatus(row.status, result),
    progress: row.progress,
    stage: row.stage,
    measurementSets: readRefs(row.measurementSetsJson).map((d) => ({
      ...d,
      valueUnit: valueUnitOf(d.kind),
      excludeRows: d.excludeRows ?? [],
      excludeReason: d.excludeReason ?? null,
    })),
    options: storedFitOptions.parse(JSON.parse(row.optionsJson)),
    codeVersion: row.codeVersion,
    createdAt: row.createdAt,
    createdBy: row.createdBy,
    createdByName: row.createdByName,
    startedAt: row.startedAt,
    finishedAt: row.finishedAt,
    jobId: row.jobId,
    error: row.error ?? (result?.status === 'failed' ? (result.failureReason ?? 'The fit failed.') : null),
    // Results stored before `converged` existed say it through their status.
    result: result ? { ...result, converged: result.status === 'succeeded' } : null,
  };
}

export function toFitListItemView(r: FitListRow): FitListItem {
  const result = readResult(r.resultJson);
  return {
    id: r.id,
    number: r.number,
    createdAt: r.createdAt,
    createdByName: r.createdByName,
    status: fitStatus(r.status, result),
    progress: r.progress,
    measurementSets: readRefs(r.measurementSetsJson).map((d) => ({
      measurementSetId: d.measurementSetId,
      name: d.name,
      kind: d.kind,
      version: d.version,
      excludeRows: d.excludeRows ?? [],
    })),
    // As on the fit page: a failed fit shows its last iterate, marked not converged, without standard errors.
    epsilonK: result?.epsilonK ?? null,
    sigmaAngstrom: result?.sigmaAngstrom ?? null,
    converged: result ? result.status === 'succeeded' : null,
    stdErr: result ? (result.status === 'succeeded' ? result.stdErr : { epsilonK: null, sigmaAngstrom: null }) : null,
    heldParameters: result?.heldParameters ?? [],
    reducedChi2: result?.reducedChi2 ?? null,
    warnings: result?.warnings ?? [],
  };
}
