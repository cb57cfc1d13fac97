import type { Insertable } from 'kysely';
import type { Db, Tx } from '../../db/database';
import type { NoticeTable } from './notices.table';

export async function insertNotice(db: Db | Tx, values: Insertable<NoticeTable>): Promise<void> {
  await db.insertInto('notice').values(values).execute();
}

/** The newest `limit` notices of one person. */
export async function recentNoticesOf(db: Db | Tx, userId: string, limit: number) {
  return db
    .selectFrom('notice')
    .select(['id', 'text', 'link', 'createdAt', 'readAt'])
    .where('userId', '=', userId)
    .orderBy('id', 'desc')
    .limit(limit)
    .execute();
}

export async function countUnreadNotices(db: Db | Tx, userId: string): Promise<number> {
  const row = await db
    .selectFrom('notice')
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .where('userId', '=', userId)
    .where('readAt', 'is', null)
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

/** One notice of this person's, or undefined (someone else's included). */
export async function findOwnNotice(db: Db | Tx, userId: string, id: number) {
  return db.selectFrom('notice').select(['id', 'readAt']).where('id', '=', id).where('userId', '=', userId).executeTakeFirst();
}

export async function setNoticeRead(db: Db | Tx, id: number, readAt: string): Promise<void> {
  await db.updateTable('notice').set({ readAt }).where('id', '=', id).execute();
}
