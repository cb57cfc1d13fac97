import { Router } from 'express';
import { pairSetListView, pairSetView as pairSetViewSchema } from '../../../shared/contracts/pair-set';
import { pairSetCreateBody, pairSetListQuery, pairSetReviewBody } from '../../../shared/schemas/pair-sets';
import type { AppContext } from '../../app-context';
import { hasPolicy } from '../../../shared/auth/roles';
import { currentUser, requirePolicy } from '../../common/auth-middleware';
import { notFound } from '../../common/errors';
import { sendView } from '../../common/respond';
import { idParams, validBody, validParams, validQuery } from '../../common/validate';
import { createPairSet, listPairSets, pairSetView, reviewPairSet } from './pair-sets.service';

/**
 * Pair sets (fitted k_ij, l_ij of two approved sets): modellers fit and submit them, reviewers decide, everyone who
 * reads parameter sets reads them.
 */
export function pairSetRoutes(ctx: AppContext): Router {
  const router = Router();

  // Consumers read published work only (README roles table): approved pair sets; others do not exist for them.
  const seesUnpublished = (res: Parameters<typeof currentUser>[0]) => hasPolicy(currentUser(res).roles, 'parameterSet:comment');

  router.get('/pair-sets', requirePolicy('parameterSet:read'), async (req, res) => {
    const { state } = validQuery(pairSetListQuery, req);
    const all = await listPairSets(ctx.db, state);
    sendView(res, pairSetListView, { pairSets: seesUnpublished(res) ? all : all.filter((p) => p.state === 'approved') });
  });

  router.post('/pair-sets', requirePolicy('parameterSet:draft'), async (req, res) => {
    const body = validBody(pairSetCreateBody, req);
    sendView(res, pairSetViewSchema, await createPairSet(ctx.db, currentUser(res), body), 201);
  });

  router.get('/pair-sets/:id', requirePolicy('parameterSet:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const view = await pairSetView(ctx.db, id);
    if (!view || (!seesUnpublished(res) && view.state !== 'approved')) throw notFound(`Pair set ${id}`);
    sendView(res, pairSetViewSchema, view);
  });

  router.post('/pair-sets/:id/review', requirePolicy('parameterSet:review'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const { decision, comment } = validBody(pairSetReviewBody, req);
    sendView(res, pairSetViewSchema, await reviewPairSet(ctx.db, currentUser(res), id, decision, comment));
  });

  return router;
}
