import { Router } from 'express';
import { createFitBody } from '../../../shared/schemas/fits';
import type { AppContext } from '../../app-context';
import { hasPolicy, mayChangeWorkOf, refusalMessage } from '../../../shared/auth/roles';
import { fitCreatedView, fitListView, fitView } from '../../../shared/contracts/fit';
import { currentUser, requirePolicy, requireUser } from '../../common/auth-middleware';
import { AppError, conflict, forbidden, notFound } from '../../common/errors';
import { sendView } from '../../common/respond';
import { idParams, validBody, validParams } from '../../common/validate';
import { recordAudit } from '../audit/audit.service';
import { findSubstance } from '../substances/substances.repository';
import { backsPublishedSet } from './fits.repository';
import { createFit, listFitsOfSubstance, requireFit } from './fits.service';
import { toFitView } from './fits.view';

export function fitRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.post('/fits', requirePolicy('fit:run'), async (req, res) => {
    const body = validBody(createFitBody, req);
    const created = await createFit(ctx, currentUser(res), body);
    sendView(res, fitCreatedView, created, 202);
  });

  // Review roles read every fit; anyone else (consumers) only a fit behind a published parameter set, the
  // one its catalog card shows. Other fits answer 404 to them, like unpublished sets.
  router.get('/fits/:id', requirePolicy('catalog:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    if (!hasPolicy(currentUser(res).roles, 'fit:read') && !(await backsPublishedSet(db, id))) throw notFound(`Fit ${id}`);
    sendView(res, fitView, toFitView(await requireFit(db, id)));
  });

  // Ownership rule (shared/auth/roles.ts mayChangeWorkOf): the fit's author or an admin.
  router.post('/fits/:id/cancel', requireUser, async (req, res) => {
    const { id } = validParams(idParams, req);
    const actor = currentUser(res);
    if (!hasPolicy(actor.roles, 'fit:run') && !actor.roles.includes('admin'))
      throw forbidden(refusalMessage(actor.roles, 'fit:run', ['admin']));
    const fit = await requireFit(db, id);
    if (!mayChangeWorkOf(actor, fit.createdBy, 'fit:run')) {
      throw new AppError(403, 'not_author', `Only the author of Fit #${fit.number} (${fit.createdByName}) or an admin may cancel it.`);
    }
    if (!(await ctx.jobs.cancel(fit.jobId)))
      throw conflict(`Fit #${fit.number} is ${fit.status}; only a queued or running fit can be cancelled.`);
    const onBehalf = actor.id === fit.createdBy ? '' : ` (as admin; the fit is ${fit.createdByName}'s)`;
    await recordAudit(db, {
      actor,
      action: 'fit.cancelled',
      targetType: 'fit',
      targetId: id,
      summary: `${actor.email} cancelled Fit #${fit.number} of ${fit.substanceName}${onBehalf}`,
    });
    sendView(res, fitView, toFitView(await requireFit(db, id)));
  });

  router.get('/substances/:id/fits', requirePolicy('fit:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    if (!(await findSubstance(db, id))) throw notFound(`Substance ${id}`);
    sendView(res, fitListView, { fits: await listFitsOfSubstance(db, id) });
  });

  return router;
}
