import { type CombiningRule, COMBINING_RULE_INFO, mixtureTable } from '../../../shared/mixing/combining-rules';
import { commonValidity, ExportError, mixtureCutoff } from '../../../shared/export/export-common';
import {
  exportMixture,
  exportOptionsFromQuery,
  exportParameterSet,
  type ExportableParameterSet,
  type ExportFormat,
  type ExportResult,
} from '../../../shared/export/parameter-set-export';
import { isVisibleTo, PUBLISHED_STATES, STATE_LABELS, type ParameterSetState } from '../../../shared/parameter-sets/transitions';
import type { CatalogEntry, MixtureAnswer, ParameterCard } from '../../../shared/contracts/catalog';
import type { PropertyKind } from '../../../shared/measurements/property-kinds';
import type { CatalogQuery } from '../../../shared/schemas/catalog';
import type { CurrentUser } from '../../common/auth-middleware';
import { AppError, notFound } from '../../common/errors';
import type SQLite from 'better-sqlite3';
import type { Db } from '../../db/database';
import { versionSources } from '../measurement-sets/measurement-sets.repository';
import { getParameterSetDetail } from '../parameter-sets/parameter-sets.service';
import { readMeasurementSetRefs } from '../parameter-sets/parameter-sets.view';
import { approvals, findCatalogRow, listCatalogRows, versionRows } from './catalog.repository';
import { toCatalogEntryView, toExportableParameterSet, toParameterCardVersionView } from './catalog.view';

/**
 * States the export and mixture routes serve: the approved version and the superseded ones it replaced
 * (kept reproducible). Drafts, sets in review or sent back, and retired sets are never exported.
 */
export const EXPORTABLE_STATES: readonly ParameterSetState[] = ['approved', 'superseded'];

export type { CatalogEntry };

/** True when a catalog entry passes the search filters of GET /api/catalog. */
function matchesQuery(e: CatalogEntry, query: CatalogQuery): boolean {
  const needle = query.q?.toLowerCase();
  if (needle && !e.substanceName.toLowerCase().includes(needle) && !(e.formula ?? '').toLowerCase().includes(needle)) return false;
  if (query.scheme && e.scheme !== query.scheme) return false;
  if (query.kind?.length && !query.kind.every((k) => e.kinds.includes(k as PropertyKind))) return false;
  // Overlap of the closed ranges [tMin, tMax] and the set's validity.
  if (query.tMinK !== undefined && e.validity.temperatureMaxK < query.tMinK) return false;
  if (query.tMaxK !== undefined && e.validity.temperatureMinK > query.tMaxK) return false;
  return true;
}

/** Every current approved set as the catalog lists it: two queries, whatever the number of sets. */
async function loadCatalogEntries(db: Db): Promise<CatalogEntry[]> {
  const rows = await listCatalogRows(db, ['approved']);
  const approvalsById = await approvals(
    db,
    rows.map((r) => r.approveTransitionId).filter((x): x is number => x != null),
  );
  return rows.map((r) => toCatalogEntryView(r, r.approveTransitionId != null ? approvalsById.get(r.approveTransitionId) : undefined));
}

/** GET /api/catalog: the current approved version of each substance and scheme, filtered. */
export async function searchCatalog(db: Db, query: CatalogQuery): Promise<CatalogEntry[]> {
  return (await loadCatalogEntries(db)).filter((e) => matchesQuery(e, query));
}

/**
 * GET /api/catalog for many readers: the entries (values, approvals, kinds parsed from their JSON) and each
 * entry's JSON text are built once and reused until the database changes. "Changed" is SQLite's own count:
 * total_changes() for writes on this connection and data_version for commits by any other connection (a
 * worker process), so no write path has to remember to invalidate anything. A request then costs one tiny
 * statement, the filter and a string join.
 */
export function cachedCatalogSearch(db: Db, sqlite: SQLite.Database) {
  const changeMark = sqlite.prepare('select total_changes() as tc, (select data_version from pragma_data_version()) as dv');
  let cache: { mark: string; entries: Promise<Array<{ entry: CatalogEntry; json: string }>> } | undefined;
  return async (query: CatalogQuery): Promise<string> => {
    const { tc, dv } = changeMark.get() as { tc: number; dv: number };
    const mark = `${dv}:${tc}`;
    if (cache?.mark !== mark) {
      const entries = loadCatalogEntries(db).then((list) => list.map((entry) => ({ entry, json: JSON.stringify(entry) })));
      cache = { mark, entries };
      entries.catch(() => {
        if (cache?.entries === entries) cache = undefined;
      });
    }
    const kept = (await cache.entries).filter((e) => matchesQuery(e.entry, query));
    return `{"sets":[${kept.map((e) => e.json).join(',')}]}`;
  };
}

/** A published set, or 404 (unpublished sets have no card; the review page shows them to the review roles). */
async function requirePublishedRow(db: Db, id: number) {
  const row = await findCatalogRow(db, id);
  if (!row || !PUBLISHED_STATES.includes(row.state)) throw notFound(`Parameter set ${id} in the catalog`);
  return row;
}

/**
 * GET /api/catalog/:id: the parameter card. Values, validity, approval, measurement sets with sources,
 * fit statistics, and every published version of the same substance and scheme with what changed.
 */
export async function parameterCard(db: Db, id: number, viewer: CurrentUser): Promise<ParameterCard> {
  const row = await requirePublishedRow(db, id);
  const detail = await getParameterSetDetail(db, id, viewer);
  const versions = await versionRows(db, row.substanceId, row.scheme, PUBLISHED_STATES);
  const approvalIds = [row, ...versions].map((r) => r.approveTransitionId).filter((x): x is number => x != null);
  const approvalsById = await approvals(db, approvalIds);
  const approval = row.approveTransitionId != null ? approvalsById.get(row.approveTransitionId) : undefined;
  const current = versions.find((v) => v.state === 'approved') ?? null;
  return {
    ...toCatalogEntryView(row, approval),
    molarMassGPerMol: row.molarMassGramsPerMol,
    approvalComment: approval?.comment ?? null,
    rationale: detail.rationale,
    fit: detail.fit,
    measurementSets: detail.measurementSets,
    exportable: EXPORTABLE_STATES.includes(row.state),
    currentApprovedId: current?.id ?? null,
    // Oldest first; each version's change is against the published version before it.
    versions: versions.map((v, k) =>
      toParameterCardVersionView(
        v,
        k > 0 ? versions[k - 1] : null,
        v.approveTransitionId != null ? approvalsById.get(v.approveTransitionId) : undefined,
      ),
    ),
  };
}

/**
 * A set as the exporters take it. 404 when the viewer may not see it (a consumer learns nothing about an
 * unpublished set), 409 when they may see it but it is not in an exportable state.
 */
export async function exportableSet(db: Db, id: number, viewer: CurrentUser, field = 'id'): Promise<ExportableParameterSet> {
  const row = await findCatalogRow(db, id);
  if (!row || !isVisibleTo(row.state, viewer.roles)) throw notFound(`Parameter set ${id}`);
  if (!EXPORTABLE_STATES.includes(row.state)) {
    throw new AppError(
      409,
      'not_exportable',
      `Parameter set ${id} is ${STATE_LABELS[row.state]}; only approved and superseded sets are exported.`,
      [{ field, message: `set ${id} is ${row.state}` }],
    );
  }
  const sources = await versionSources(
    db,
    readMeasurementSetRefs(row.measurementSetsJson).map((r) => r.versionId),
  );
  const approval =
    row.approveTransitionId != null ? (await approvals(db, [row.approveTransitionId])).get(row.approveTransitionId) : undefined;
  return toExportableParameterSet(row, approval, sources);
}

/** Runs an exporter; its refusals become 400 answers in the API's error shape. */
export function runExport(fn: () => ExportResult, field: string): ExportResult {
  try {
    return fn();
  } catch (err) {
    if (err instanceof ExportError)
      throw new AppError(400, err.code.replace(/-/g, '_'), err.message, [
        { field: err.code === 'unknown-unit' ? 'units' : field, message: err.message },
      ]);
    throw err;
  }
}

export function exportSetFile(set: ExportableParameterSet, format: ExportFormat, units: string | undefined): ExportResult {
  return runExport(() => exportParameterSet(set, format, exportOptionsFromQuery(units)), 'format');
}

export function exportMixtureFile(
  sets: ExportableParameterSet[],
  rule: CombiningRule,
  format: ExportFormat,
  units: string | undefined,
): ExportResult {
  return runExport(() => exportMixture(sets, rule, format, exportOptionsFromQuery(units)), 'sets');
}

/** GET /api/mixtures without a format: the pair table as JSON. Cross pairs are combining-rule estimates. */
export function mixtureJson(sets: ExportableParameterSet[], rule: CombiningRule): MixtureAnswer {
  const table = mixtureTable(sets, rule);
  const info = COMBINING_RULE_INFO[rule];
  return {
    rule,
    ruleName: info.name,
    formulas: info.formulas,
    reference: info.reference,
    components: sets.map((s, index) => ({
      index,
      setId: s.id,
      version: s.version,
      state: s.state,
      substanceName: s.substance.name,
      scheme: s.scheme,
      cutoffSigma: s.cutoffSigma,
      epsilonK: s.epsilonK,
      sigmaAngstrom: s.sigmaAngstrom,
    })),
    pairs: table.pairs.map((p) => ({
      i: p.i,
      j: p.j,
      setIdI: sets[p.i].id,
      setIdJ: sets[p.j].id,
      substanceI: sets[p.i].substance.name,
      substanceJ: sets[p.j].substance.name,
      epsilonK: p.epsilonK,
      sigmaAngstrom: p.sigmaAngstrom,
      kind: p.kind,
      // Fitted pairs carry their pair set, k_ij (l_ij) and the standard errors of the cross parameters.
      ...(p.fitted
        ? {
            pairSetId: p.fitted.pairSetId,
            kij: p.fitted.kij,
            kijStdErr: p.fitted.kijStdErr,
            lij: p.fitted.lij,
            epsilonStdErrK: p.fitted.epsilonStdErrK,
            sigmaStdErrAngstrom: p.fitted.sigmaStdErrAngstrom,
          }
        : {}),
    })),
    note: table.note,
    commonValidity: commonValidity(sets),
    cutoff: mixtureCutoff(sets),
  };
}
