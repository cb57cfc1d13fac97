import { sql } from 'kysely';
import type { OutboxCounts } from '../../../shared/contracts/mail';
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

/** Outbox rows whose time has come, oldest first. */
export async function dueOutboxRows(db: Db, now: Date, limit = 20) {
  return db
    .selectFrom('mailOutbox')
    .selectAll()
    .where('status', '=', 'queued')
    .where('nextAttemptAt', '<=', now.toISOString())
    .orderBy('nextAttemptAt')
    .orderBy('id')
    .limit(limit)
    .execute();
}

/** Counts per outbox status, for health checks and tests. */
export async function outboxCounts(db: Db) {
  const rows = await db.selectFrom('mailOutbox').select(['status', sql<number>`count(*)`.as('n')]).groupBy('status').execute();
  return { queued: 0, sent: 0, failed: 0, ...Object.fromEntries(rows.map((r) => [r.status, Number(r.n)])) } as OutboxCounts;
}
