import { sql } from 'kysely';
import type { Db } from '../../db/database';

/** Messages received by the local fake mail service, newest first; `to` matches a recipient substring. */
export async function listMailbox(db: Db, filter: { to?: string; limit: number }) {
  let q = db.selectFrom('mailboxMessage').selectAll().orderBy('id', 'desc').limit(filter.limit);
  if (filter.to) q = q.where(sql<boolean>`instr(lower(to_json), ${filter.to.toLowerCase()}) > 0`);
  return q.execute();
}

/** Outbox rows newest first, optionally of one status, with counts per status. */
export async function listOutbox(db: Db, filter: { status?: 'queued' | 'sent' | 'failed'; limit: number }) {
  let q = db.selectFrom('mailOutbox').selectAll().orderBy('id', 'desc').limit(filter.limit);
  if (filter.status) q = q.where('status', '=', filter.status);
  return q.execute();
}
