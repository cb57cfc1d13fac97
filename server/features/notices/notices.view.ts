import type { Selectable } from 'kysely';
import type { NoticeView } from '../../../shared/contracts/notice';
import type { NoticeTable } from './notices.table';

/** The columns of a notice its owner sees (not the owner or the reason). */
export type NoticeViewColumns = Pick<Selectable<NoticeTable>, 'id' | 'text' | 'link' | 'createdAt' | 'readAt'>;

export const toNoticeView = (row: NoticeViewColumns): NoticeView => ({
  id: row.id,
  text: row.text,
  link: row.link,
  createdAt: row.createdAt,
  readAt: row.readAt,
});
