import { sql } from 'kysely';
import type { Db } from '../../db/database';

/** Messages received by the local fake mail service, newest first; `to` matches a recipient substring. */
export async function listMailbox(db: Db, filter: { to?: string; limit: number }) {
  let q = db.selectFrom('mailboxMessage').selectAll().orderBy('id', 'desc').limit(filter.limit);
  if (filter.to) q = q.where(sql<boolean>`instr(lower(to_json), ${filter.to.toLowerCase()}) > 0`);
  return q.execute();
}
