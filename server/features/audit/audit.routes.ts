import { Router } from 'express';
import { z } from 'zod';
import { requirePolicy } from '../../common/auth-middleware';
import { validQuery } from '../../common/validate';
import type { AppContext } from '../../app-context';
import { auditPageView, auditVocabularyView } from '../../../shared/contracts/audit';
import { sendView } from '../../common/respond';
import { auditVocabulary, listAuditEvents, targetLabels } from './audit.repository';
import { toAuditEventView } from './audit.view';

const DATE_ONLY = /^\d{4}-\d{2}-\d{2}$/;
const instant = z
  .string()
  .trim()
  .refine((s) => (DATE_ONLY.test(s) || /^\d{4}-\d{2}-\d{2}T/.test(s)) && !Number.isNaN(Date.parse(s)), 'expected an ISO date (2026-12-01) or date-time');

const auditQuery = z
  .object({
    action: z.string().trim().min(1).max(100).optional(),
    actor: z.string().trim().min(1).max(200).optional(),
    targetType: z.string().trim().min(1).max(100).optional(),
    targetId: z.string().trim().min(1).max(100).optional(),
    from: instant.optional(),
    to: instant.optional(),
    limit: z.coerce.number().int().min(1).max(500).default(100),
    before: z.coerce.number().int().positive().optional(),
  })
  .refine((q) => !q.from || !q.to || toInstant(q.from, 'start') < toInstant(q.to, 'end'), { path: ['to'], message: '"to" must come after "from"' });

/**
 * A date alone means the whole day in UTC: `from=2026-12-01` starts at its midnight, `to=2026-12-01`
 * ends at the next midnight, so from=to=that day lists that day.
 */
function toInstant(value: string, side: 'start' | 'end'): string {
  const date = new Date(DATE_ONLY.test(value) ? `${value}T00:00:00Z` : value);
  if (DATE_ONLY.test(value) && side === 'end') date.setUTCDate(date.getUTCDate() + 1);
  return date.toISOString();
}

export function auditRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.get('/audit', requirePolicy('audit:read'), async (req, res) => {
    const q = validQuery(auditQuery, req);
    const rows = await listAuditEvents(db, {
      action: q.action,
      actor: q.actor,
      targetType: q.targetType,
      targetId: q.targetId,
      fromIso: q.from ? toInstant(q.from, 'start') : undefined,
      toIso: q.to ? toInstant(q.to, 'end') : undefined,
      before: q.before,
      limit: q.limit,
    });
    const page = rows.slice(0, q.limit);
    const labels = await targetLabels(db, page);
    sendView(res, auditPageView, {
      events: page.map((e) => toAuditEventView(e, labels.get(`${e.targetType}:${e.targetId}`) ?? null)),
      nextBefore: rows.length > q.limit ? page[page.length - 1].id : null,
    });
  });

  router.get('/audit/vocabulary', requirePolicy('audit:read'), async (_req, res) => {
    sendView(res, auditVocabularyView, await auditVocabulary(db));
  });

  return router;
}
