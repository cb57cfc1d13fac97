import type { Generated } from 'kysely';

export interface NoticeTable {
  id: Generated<number>;
  userId: string;
  text: string;
  link: string | null;
  /** What caused it, e.g. 'fit.succeeded'. */
  reason: string;
  createdAt: string;
  readAt: string | null;
}
