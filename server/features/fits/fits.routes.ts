import { Router } from 'express';
import { createFitBody } from '../../../shared/schemas/fits';
import type { AppContext } from '../../app-context';
import { hasPolicy, mayChangeWorkOf, refusalMessage } from '../../../shared/auth/roles';
import { PUBLISHED_STATES } from '../../../shared/parameter-sets/transitions';
import { currentUser, requirePolicy, requireUser } from '../../common/auth-middleware';
import { AppError, conflict, forbidden, notFound } from '../../common/errors';
import type { Db } from '../../db/database';
import { idParams, validBody, validParams } from '../../common/validate';
import { recordAudit } from '../audit/audit.service';
import { findSubstance } from '../substances/substances.repository';
import { createFit, listFitsOfSubstance, requireFit, toFitView } from './fits.service';

/** True when an approved, superseded or retired parameter set was drafted from the fit. */
async function backsPublishedSet(db: Db, fitId: number): Promise<boolean> {
  const row = await db.selectFrom('parameterSet').select('id').where('fitId', '=', fitId).where('state', 'in', [...PUBLISHED_STATES]).executeTakeFirst();
  return row !== undefined;
}

export function fitRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.post('/fits', requirePolicy('fit:run'), async (req, res) => {
    const body = validBody(createFitBody, req);
    const created = await createFit(ctx, currentUser(res), body);
    res.status(202).json(created);
  });

  // Review roles read every fit; anyone else (consumers) only a fit behind a published parameter set, the
  // one its catalog card shows. Other fits answer 404 to them, like unpublished sets.
  router.get('/fits/:id', requirePolicy('catalog:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    if (!hasPolicy(currentUser(res).roles, 'fit:read') && !(await backsPublishedSet(db, id))) throw notFound(`Fit ${id}`);
    res.json(toFitView(await requireFit(db, id)));
  });

  // Ownership rule (shared/auth/roles.ts mayChangeWorkOf): the fit's author or an admin.
  router.post('/fits/:id/cancel', requireUser, async (req, res) => {
    const { id } = validParams(idParams, req);
    const actor = currentUser(res);
    if (!hasPolicy(actor.roles, 'fit:run') && !actor.roles.includes('admin')) throw forbidden(refusalMessage(actor.roles, 'fit:run', ['admin']));
    const fit = await requireFit(db, id);
    if (!mayChangeWorkOf(actor, fit.createdBy, 'fit:run')) {
      throw new AppError(403, 'not_author', `Only the author of Fit #${fit.number} (${fit.createdByName}) or an admin may cancel it.`);
    }
    if (!(await ctx.jobs.cancel(fit.jobId))) throw conflict(`Fit #${fit.number} is ${fit.status}; only a queued or running fit can be cancelled.`);
    const onBehalf = actor.id === fit.createdBy ? '' : ` (as admin; the fit is ${fit.createdByName}'s)`;
    await recordAudit(db, { actor, action: 'fit.cancelled', targetType: 'fit', targetId: id, summary: `${actor.email} cancelled Fit #${fit.number} of ${fit.substanceName}${onBehalf}` });
    res.json(toFitView(await requireFit(db, id)));
  });

  router.get('/substances/:id/fits', requirePolicy('fit:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    if (!(await findSubstance(db, id))) throw notFound(`Substance ${id}`);
    res.json({ fits: await listFitsOfSubstance(db, id) });
  });

  return router;
}
