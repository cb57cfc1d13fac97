/**
 * Contract of an in-app notice: the answer of GET /api/notices (one's own newest notices and the unread count).
 * Built in server/features/notices/notices.view.ts; POST /api/notices/:id/read answers 204 with no body.
 */
import { z } from 'zod';

export const noticeView = z.strictObject({
  id: z.number().int(),
  text: z.string(),
  /** Path inside the app (e.g. /fits/3), or null. */
  link: z.string().nullable(),
  createdAt: z.string(),
  readAt: z.string().nullable(),
});
export type NoticeView = z.infer<typeof noticeView>;

export const noticeListView = z.strictObject({ notices: z.array(noticeView), unread: z.number().int().nonnegative() });
export type NoticeList = z.infer<typeof noticeListView>;
