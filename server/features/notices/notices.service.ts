import type { Db, Tx } from '../../db/database';
import { notFound } from '../../common/errors';

export interface NewNotice {
  userId: string;
  text: string;
  /** Path inside the app (e.g. /fits/3). */
  link: string | null;
  reason: string;
}

/** Adds an in-app notice; call it inside the transaction of the change it tells of. */
export async function addNotice(executor: Db | Tx, notice: NewNotice): Promise<void> {
  await executor.insertInto('notice').values({ ...notice, text: notice.text.slice(0, 1000), createdAt: new Date().toISOString(), readAt: null }).execute();
}

/** The newest notices of one person (at most 50) and how many are unread. */
export async function noticesOf(db: Db, userId: string) {
  const notices = await db.selectFrom('notice').select(['id', 'text', 'link', 'createdAt', 'readAt']).where('userId', '=', userId).orderBy('id', 'desc').limit(50).execute();
  const unread = await db.selectFrom('notice').select((eb) => eb.fn.countAll<number>().as('n')).where('userId', '=', userId).where('readAt', 'is', null).executeTakeFirstOrThrow();
  return { notices, unread: Number(unread.n) };
}

/** Marks one's own notice read (again is harmless); someone else's notice is answered as missing. */
export async function markNoticeRead(db: Db, userId: string, id: number): Promise<void> {
  const row = await db.selectFrom('notice').select(['id', 'readAt']).where('id', '=', id).where('userId', '=', userId).executeTakeFirst();
  if (!row) throw notFound(`Notice ${id}`);
  if (!row.readAt) await db.updateTable('notice').set({ readAt: new Date().toISOString() }).where('id', '=', id).execute();
}
