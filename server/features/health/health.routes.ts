import { Router } from 'express';
import { healthView } from '../../../shared/contracts/health';
import type { AppContext } from '../../app-context';
import { sendView } from '../../common/respond';
import pkg from '../../../package.json' with { type: 'json' };
import { pingDatabase } from './health.repository';
import { toHealthView } from './health.view';

export function healthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    await pingDatabase(ctx.db);
    sendView(res, healthView, toHealthView(pkg.version, await ctx.jobs.health(), new Date()));
  });
  return router;
}
