import { sql } from 'kysely';
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
  let q = db.selectFrom('auditEvent').selectAll().orderBy('id', 'desc').limit(f.limit + 1);
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
