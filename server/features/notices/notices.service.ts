import type { NoticeList } from '../../../shared/contracts/notice';
import type { Db, Tx } from '../../db/database';
import { notFound } from '../../common/errors';
import { countUnreadNotices, findOwnNotice, insertNotice, recentNoticesOf, setNoticeRead } from './notices.repository';
import { toNoticeView } from './notices.view';

export interface NewNotice {
  userId: string;
  text: string;
  /** Path inside the app (e.g. /fits/3). */
  link: string | null;
  reason: string;
}

/** Adds an in-app notice; call it inside the transaction of the change it tells of. */
export async function addNotice(executor: Db | Tx, notice: NewNotice): Promise<void> {
  await insertNotice(executor, { ...notice, text: notice.text.slice(0, 1000), createdAt: new Date().toISOString(), readAt: null });
}

/** The newest notices of one person (at most 50) and how many are unread. */
export async function noticesOf(db: Db, userId: string): Promise<NoticeList> {
  const notices = await recentNoticesOf(db, userId, 50);
  return { notices: notices.map(toNoticeView), unread: await countUnreadNotices(db, userId) };
}

/** Marks one's own notice read (again is harmless); someone else's notice is answered as missing. */
export async function markNoticeRead(db: Db, userId: string, id: number): Promise<void> {
  const row = await findOwnNotice(db, userId, id);
  if (!row) throw notFound(`Notice ${id}`);
  if (!row.readAt) await setNoticeRead(db, id, new Date().toISOString());
}
