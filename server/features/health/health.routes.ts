import { sql } from 'kysely';
import { Router } from 'express';
import type { AppContext } from '../../app-context';
import pkg from '../../../package.json' with { type: 'json' };

export function healthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    await sql`select 1`.execute(ctx.db);
    res.json({ status: 'ok', version: pkg.version, database: 'ok', time: new Date().toISOString() });
  });
  return router;
}
