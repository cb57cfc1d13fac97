import { sql, type Insertable, type Updateable } from 'kysely';
import type { OutboxCounts } from '../../../shared/contracts/mail';
import type { Role } from '../../../shared/auth/roles';
import type { Db, Tx } from '../../db/database';
import type { MailOutboxTable } from './mail.table';

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
  const rows = await db
    .selectFrom('mailOutbox')
    .select(['status', sql<number>`count(*)`.as('n')])
    .groupBy('status')
    .execute();
  return { queued: 0, sent: 0, failed: 0, ...Object.fromEntries(rows.map((r) => [r.status, Number(r.n)])) } as OutboxCounts;
}

/** Appends one outbox row (inside the caller's transaction) and returns its id. */
export async function insertOutboxRow(executor: Db | Tx, values: Insertable<MailOutboxTable>): Promise<number> {
  return (await executor.insertInto('mailOutbox').values(values).returning('id').executeTakeFirstOrThrow()).id;
}

/** E-mail addresses of active users holding the role (e.g. every reviewer when a set is submitted). */
export async function emailsOfRole(db: Db | Tx, role: Role): Promise<string[]> {
  const rows = await db
    .selectFrom('user')
    .innerJoin('userRole', 'userRole.userId', 'user.id')
    .select('user.email')
    .where('userRole.role', '=', role)
    .where('user.active', '=', 1)
    .orderBy('user.email')
    .execute();
  return rows.map((r) => r.email);
}

/** E-mail addresses of active users following the substance. */
export async function emailsOfFollowers(db: Db | Tx, substanceId: number): Promise<string[]> {
  const rows = await db
    .selectFrom('substanceFollow')
    .innerJoin('user', 'user.id', 'substanceFollow.userId')
    .select('user.email')
    .where('substanceFollow.substanceId', '=', substanceId)
    .where('user.active', '=', 1)
    .orderBy('user.email')
    .execute();
  return rows.map((r) => r.email);
}

/** Records how a send went (status, attempts, error, next attempt). */
export async function updateOutboxRow(db: Db, id: number, values: Updateable<MailOutboxTable>): Promise<void> {
  await db.updateTable('mailOutbox').set(values).where('id', '=', id).execute();
}
