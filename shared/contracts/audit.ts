/**
 * Contract of the audit trail: the answers of GET /api/audit (one page of events, newest first) and
 * GET /api/audit/vocabulary (the filter menus). Built in server/features/audit/audit.view.ts.
 * before/after are the stored JSON of the change as it was written then: the log is append-only, so they keep
 * the spelling of their time (old rows say datasetId) and are not parsed further. vocabulary: keep
 */
import { z } from 'zod';

export const auditEventView = z.strictObject({
  id: z.number().int(),
  at: z.string(),
  actorEmail: z.string().nullable(),
  action: z.string(),
  targetType: z.string(),
  targetId: z.string().nullable(),
  /** The target as the screens name it ("Fit #3 of norrane"); null when it is gone or of an unknown type. */
  targetLabel: z.string().nullable(),
  summary: z.string(),
  before: z.unknown(),
  after: z.unknown(),
});
export type AuditEvent = z.infer<typeof auditEventView>;

/** One page; `nextBefore` is the `before` of the next (older) page, null on the last. */
export const auditPageView = z.strictObject({ events: z.array(auditEventView), nextBefore: z.number().int().nullable() });
export type AuditPage = z.infer<typeof auditPageView>;

export const auditVocabularyView = z.strictObject({ actions: z.array(z.string()), targetTypes: z.array(z.string()) });
export type AuditVocabulary = z.infer<typeof auditVocabularyView>;
