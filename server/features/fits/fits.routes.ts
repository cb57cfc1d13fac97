import { Router } from 'express';
import { createFitBody } from '../../../shared/schemas/fits';
import type { AppContext } from '../../app-context';
import { currentUser, requirePolicy } from '../../common/auth-middleware';
import { conflict, notFound } from '../../common/errors';
import { idParams, validBody, validParams } from '../../common/validate';
import { recordAudit } from '../audit/audit.service';
import { findSubstance } from '../substances/substances.repository';
import { createFit, listFitsOfSubstance, requireFit, toFitView } from './fits.service';

export function fitRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.post('/fits', requirePolicy('fit:run'), async (req, res) => {
    const body = validBody(createFitBody, req);
    const created = await createFit(ctx, currentUser(res), body);
    res.status(202).json(created);
  });

  router.get('/fits/:id', requirePolicy('fit:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    res.json(toFitView(await requireFit(db, id)));
  });

  router.post('/fits/:id/cancel', requirePolicy('fit:run'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const fit = await requireFit(db, id);
    const actor = currentUser(res);
    if (!(await ctx.jobs.cancel(fit.jobId))) throw conflict(`Fit #${fit.number} is ${fit.status}; only a queued or running fit can be cancelled.`);
    await recordAudit(db, { actor, action: 'fit.cancelled', targetType: 'fit', targetId: id, summary: `${actor.email} cancelled Fit #${fit.number} of ${fit.substanceName}` });
    res.json(toFitView(await requireFit(db, id)));
  });

  router.get('/substances/:id/fits', requirePolicy('fit:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    if (!(await findSubstance(db, id))) throw notFound(`Substance ${id}`);
    res.json({ fits: await listFitsOfSubstance(db, id) });
  });

  return router;
}
