import { sql } from 'kysely';
import { CUTOFF_SCHEME_LABELS } from '../../../shared/physics/cutoff-schemes';
import type { Db } from '../../db/database';

export interface AuditFilter {
  action?: string;
  /** Substring of the actor's e-mail, any case. */
  actor?: string;
  targetType?: string;
  targetId?: string;
  /** ISO instants; `from` inclusive, `to` exclusive. */
  fromIso?: string;
  toIso?: string;
  /** Only events with an id below this (paging backwards). */
  before?: number;
  limit: number;
}

/** Audit events newest first, one more than `limit` so the caller knows whether a further page exists. */
export async function listAuditEvents(db: Db, f: AuditFilter) {
  let q = db
    .selectFrom('auditEvent')
    .selectAll()
    .orderBy('id', 'desc')
    .limit(f.limit + 1);
  if (f.action) q = q.where('action', '=', f.action);
  if (f.actor) q = q.where(sql<boolean>`instr(lower(coalesce(actor_email, '')), ${f.actor.toLowerCase()}) > 0`);
  if (f.targetType) q = q.where('targetType', '=', f.targetType);
  if (f.targetId) q = q.where('targetId', '=', f.targetId);
  if (f.fromIso) q = q.where('at', '>=', f.fromIso);
  if (f.toIso) q = q.where('at', '<', f.toIso);
  if (f.before) q = q.where('id', '<', f.before);
  return q.execute();
}

/** Every action and target type that occurs, for the filter menus. */
export async function auditVocabulary(db: Db) {
  const actions = await db.selectFrom('auditEvent').select('action').distinct().orderBy('action').execute();
  const targetTypes = await db.selectFrom('auditEvent').select('targetType').distinct().orderBy('targetType').execute();
  return { actions: actions.map((r) => r.action), targetTypes: targetTypes.map((r) => r.targetType) };
}

const ids = (events: Array<{ targetType: string; targetId: string | null }>, type: string) => [
  ...new Set(
    events
      .filter((e) => e.targetType === type && e.targetId !== null)
      .map((e) => Number(e.targetId))
      .filter(Number.isInteger),
  ),
];

/**
 * The audit trail's targets named as the screens name them ("Fit #3 of norrane", "Norrane v2 (Full potential)",
 * "Simulation 5") instead of their internal ids; null when the target is gone or of an unknown type.
 */
export async function targetLabels(db: Db, events: Array<{ targetType: string; targetId: string | null }>): Promise<Map<string, string>> {
  const labels = new Map<string, string>();
  const put = (type: string, id: string | number, label: string) => labels.set(`${type}:${id}`, label);
  const fitIds = ids(events, 'fit');
  if (fitIds.length) {
    for (const f of await db
      .selectFrom('fit')
      .innerJoin('substance', 'substance.id', 'fit.substanceId')
      .select(['fit.id', 'fit.number', 'substance.name'])
      .where('fit.id', 'in', fitIds)
      .execute())
      put('fit', f.id, `Fit #${f.number} of ${f.name}`);
  }
  const setIds = ids(events, 'parameterSet');
  if (setIds.length) {
    const rows = await db
      .selectFrom('parameterSet')
      .innerJoin('substance', 'substance.id', 'parameterSet.substanceId')
      .select(['parameterSet.id', 'parameterSet.version', 'parameterSet.scheme', 'substance.name'])
      .where('parameterSet.id', 'in', setIds)
      .execute();
    for (const s of rows) put('parameterSet', s.id, `${s.name} v${s.version} (${CUTOFF_SCHEME_LABELS[s.scheme]})`);
  }
  const measurementSetIds = ids(events, 'dataset');
  if (measurementSetIds.length) {
    for (const d of await db.selectFrom('measurementSet').select(['id', 'name']).where('id', 'in', measurementSetIds).execute())
      put('dataset', d.id, `Measurement set “${d.name}”`);
  }
  const substanceIds = ids(events, 'substance');
  if (substanceIds.length) {
    for (const s of await db.selectFrom('substance').select(['id', 'name']).where('id', 'in', substanceIds).execute())
      put('substance', s.id, s.name);
  }
  const tokenIds = ids(events, 'apiToken');
  if (tokenIds.length) {
    for (const t of await db.selectFrom('apiToken').select(['id', 'name']).where('id', 'in', tokenIds).execute())
      put('apiToken', t.id, `Token “${t.name}”`);
  }
  for (const id of ids(events, 'job')) put('job', id, `Simulation ${id}`);
  const userIds = [...new Set(events.filter((e) => e.targetType === 'user' && e.targetId).map((e) => e.targetId as string))];
  if (userIds.length) {
    for (const u of await db.selectFrom('user').select(['id', 'name']).where('id', 'in', userIds).execute()) put('user', u.id, u.name);
  }
  return labels;
}
