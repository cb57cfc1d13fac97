import { Router } from 'express';
import { noticeListView } from '../../../shared/contracts/notice';
import type { AppContext } from '../../app-context';
import { currentUser, requireUser } from '../../common/auth-middleware';
import { sendView } from '../../common/respond';
import { idParams, validParams } from '../../common/validate';
import { markNoticeRead, noticesOf } from './notices.service';

/** Everyone signed in reads and clears their own notices, and no one else's. */
export function noticeRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/notices', requireUser, async (_req, res) => {
    sendView(res, noticeListView, await noticesOf(ctx.db, currentUser(res).id));
  });

  router.post('/notices/:id/read', requireUser, async (req, res) => {
    const { id } = validParams(idParams, req);
    await markNoticeRead(ctx.db, currentUser(res).id, id);
    res.status(204).end();
  });

  return router;
}
