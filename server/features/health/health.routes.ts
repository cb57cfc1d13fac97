import { sql } from 'kysely';
import { Router } from 'express';
import type { AppContext } from '../../app-context';
import pkg from '../../../package.json' with { type: 'json' };

export function healthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    await sql`select 1`.execute(ctx.db);
    // Counts only: which machines run the jobs is for signed-in people (GET /api/simulations/queue).
    const { workerList: _workers, ...queue } = await ctx.jobs.health();
    res.json({ status: 'ok', version: pkg.version, database: 'ok', queue, time: new Date().toISOString() });
  });
  return router;
}
