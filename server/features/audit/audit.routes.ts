import { Router } from 'express';
import { requirePolicy } from '../../common/auth-middleware';
import { validQuery } from '../../common/validate';
import type { AppContext } from '../../app-context';
import { auditPageView, auditVocabularyView } from '../../../shared/contracts/audit';
import { auditQuery, toInstant } from '../../../shared/schemas/audit';
import { sendView } from '../../common/respond';
import { auditVocabulary, listAuditEvents, targetLabels } from './audit.repository';
import { toAuditEventView } from './audit.view';

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
