import { Router } from 'express';
import { followListView, followStateView } from '../../../shared/contracts/follow';
import { currentUser, requirePolicy } from '../../common/auth-middleware';
import { notFound } from '../../common/errors';
import { sendView } from '../../common/respond';
import { idParams, validParams } from '../../common/validate';
import type { AppContext } from '../../app-context';
import { recordAudit } from '../audit/audit.service';
import { findSubstance } from '../substances/substances.repository';
import { deleteFollow, insertFollow, isFollowing, listFollowsOf } from './follows.repository';
import { toFollowView } from './follows.view';

/** Following a substance asks for mail about its parameter sets; anyone who can read substances may follow. */
export function followRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.post('/substances/:id/follow', requirePolicy('substance:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const actor = currentUser(res);
    await db.transaction().execute(async (tx) => {
      const substance = await findSubstance(tx, id);
      if (!substance) throw notFound(`Substance ${id}`);
      // Following twice is not an error and not a second event.
      if (await isFollowing(tx, actor.id, id)) return;
      await insertFollow(tx, actor.id, id);
      await recordAudit(tx, {
        actor,
        action: 'substance.followed',
        targetType: 'substance',
        targetId: id,
        summary: `${actor.email} follows ${substance.name}`,
      });
    });
    sendView(res, followStateView, { substanceId: id, following: true });
  });

  router.delete('/substances/:id/follow', requirePolicy('substance:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    const actor = currentUser(res);
    await db.transaction().execute(async (tx) => {
      const substance = await findSubstance(tx, id);
      if (!substance) throw notFound(`Substance ${id}`);
      if (await deleteFollow(tx, actor.id, id)) {
        await recordAudit(tx, {
          actor,
          action: 'substance.unfollowed',
          targetType: 'substance',
          targetId: id,
          summary: `${actor.email} stopped following ${substance.name}`,
        });
      }
    });
    sendView(res, followStateView, { substanceId: id, following: false });
  });

  router.get('/me/follows', requirePolicy('substance:read'), async (_req, res) => {
    const actor = currentUser(res);
    sendView(res, followListView, { follows: (await listFollowsOf(db, actor.id)).map(toFollowView) });
  });

  return router;
}
