import { Router } from 'express';
import { z } from 'zod';
import { PARAMETER_SET_STATES } from '../../../shared/parameter-sets/transitions';
import {
  commentBody,
  createParameterSetBody,
  FROZEN_FIELDS,
  retireParameterSetBody,
  reviewParameterSetBody,
  reviseParameterSetBody,
  updateParameterSetBody,
} from '../../../shared/schemas/parameter-sets';
import {
  parameterSetCommentView,
  parameterSetDetailView,
  parameterSetDiffView,
  parameterSetListView,
  parameterSetManifestView,
  parameterSetRerunView,
  parameterSetSummaryView,
  reviewQueueView,
} from '../../../shared/contracts/parameter-set';
import type { AppContext } from '../../app-context';
import { currentUser, requirePolicy } from '../../common/auth-middleware';
import { sendView } from '../../common/respond';
import { idParams, validBody, validParams, validQuery } from '../../common/validate';
import { diffWithPrevious } from './parameter-sets.diff';
import { manifestOf, rerunOf } from './manifest.service';
import { listReviewQueue } from './parameter-sets.repository';
import {
  addComment,
  createParameterSet,
  editDraft,
  getParameterSetDetail,
  listVisible,
  refuseUnlessEditable,
  requireSubstanceExists,
  retireParameterSet,
  reviewParameterSet,
  reviseParameterSet,
  submitParameterSet,
} from './parameter-sets.service';
import { toParameterSetView } from './parameter-sets.view';
import { withNewFieldNames } from '../../../shared/schemas/old-names';

const listQuery = z.object({
  substanceId: z.coerce.number().int().positive().optional(),
  state: z
    .string()
    .transform((s) => s.split(',').map((x) => x.trim()))
    .pipe(z.array(z.enum(PARAMETER_SET_STATES)))
    .optional(),
});

/** Parameter sets: drafting from a fit, the review moves, comments, and the Review desk's queue. */
export function parameterSetRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.post('/parameter-sets', requirePolicy('parameterSet:draft'), async (req, res) => {
    const body = validBody(createParameterSetBody, req);
    sendView(res, parameterSetSummaryView, await createParameterSet(db, currentUser(res), body), 201);
  });

  router.get('/parameter-sets', requirePolicy('parameterSet:read'), async (req, res) => {
    const { substanceId, state } = validQuery(listQuery, req);
    sendView(res, parameterSetListView, { parameterSets: await listVisible(db, currentUser(res), { substanceId, states: state }) });
  });

  router.get('/parameter-sets/:id', requirePolicy('parameterSet:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    sendView(res, parameterSetDetailView, await getParameterSetDetail(db, id, currentUser(res)));
  });

  // Reproducible by anyone who may read the set: its manifest, and a re-run of a gas-phase fit compared to the last digit.
  router.get('/parameter-sets/:id/manifest', requirePolicy('parameterSet:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    sendView(res, parameterSetManifestView, await manifestOf(db, id, currentUser(res)));
  });

  router.get('/parameter-sets/:id/rerun', requirePolicy('parameterSet:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    sendView(res, parameterSetRerunView, await rerunOf(db, id, currentUser(res)));
  });

  router.get('/parameter-sets/:id/diff', requirePolicy('parameterSet:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    sendView(res, parameterSetDiffView, await diffWithPrevious(db, id, currentUser(res)));
  });

  router.patch('/parameter-sets/:id', requirePolicy('parameterSet:draft'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const sent = withNewFieldNames(updateParameterSetBody, req.body);
    const raw = sent && typeof sent === 'object' ? (sent as Record<string, unknown>) : {};
    await refuseUnlessEditable(
      db,
      currentUser(res),
      id,
      FROZEN_FIELDS.filter((f) => f in raw),
    );
    const body = validBody(updateParameterSetBody, req);
    sendView(res, parameterSetDetailView, await editDraft(db, currentUser(res), id, body));
  });

  router.post('/parameter-sets/:id/submit', requirePolicy('parameterSet:draft'), async (req, res) => {
    const { id } = validParams(idParams, req);
    sendView(res, parameterSetDetailView, await submitParameterSet(db, currentUser(res), id));
  });

  router.post('/parameter-sets/:id/review', requirePolicy('parameterSet:review'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const { decision, comment } = validBody(reviewParameterSetBody, req);
    sendView(res, parameterSetDetailView, await reviewParameterSet(db, currentUser(res), id, decision, comment));
  });

  router.post('/parameter-sets/:id/retire', requirePolicy('parameterSet:retire'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const { reason } = validBody(retireParameterSetBody, req);
    sendView(res, parameterSetDetailView, await retireParameterSet(db, currentUser(res), id, reason));
  });

  router.post('/parameter-sets/:id/revise', requirePolicy('parameterSet:draft'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const body = validBody(reviseParameterSetBody, req);
    sendView(res, parameterSetSummaryView, await reviseParameterSet(db, currentUser(res), id, body), 201);
  });

  router.post('/parameter-sets/:id/comments', requirePolicy('parameterSet:comment'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const { body } = validBody(commentBody, req);
    sendView(res, parameterSetCommentView, await addComment(db, currentUser(res), id, body), 201);
  });

  router.get('/review-queue', requirePolicy('parameterSet:review'), async (_req, res) => {
    const rows = await listReviewQueue(db, currentUser(res).id);
    sendView(res, reviewQueueView, { parameterSets: rows.map((r) => ({ ...toParameterSetView(r), submittedAt: r.submittedAt })) });
  });

  router.get('/substances/:id/parameter-sets', requirePolicy('parameterSet:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    await requireSubstanceExists(db, id);
    sendView(res, parameterSetListView, { parameterSets: await listVisible(db, currentUser(res), { substanceId: id }) });
  });

  return router;
}
