import { Router } from 'express';
import { createTokenBody } from '../../../shared/schemas/tokens';
import type { AppContext } from '../../app-context';
import { currentUser, requirePolicy } from '../../common/auth-middleware';
import { idParams, validBody, validParams } from '../../common/validate';
import { createToken, listTokens, revokeToken } from './tokens.service';

/**
 * Personal read-only API tokens for the catalog and export routes. Managed only from a signed-in session:
 * the bearer-token guard refuses these routes to token requests.
 */
export function tokenRoutes(ctx: AppContext): Router {
  const router = Router();
  const { db } = ctx;

  router.post('/tokens', requirePolicy('catalog:read'), async (req, res) => {
    const { name } = validBody(createTokenBody, req);
    res.status(201).json(await createToken(db, currentUser(res), name));
  });

  router.get('/tokens', requirePolicy('catalog:read'), async (_req, res) => {
    res.json({ tokens: await listTokens(db, currentUser(res).id) });
  });

  router.delete('/tokens/:id', requirePolicy('catalog:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    res.json(await revokeToken(db, currentUser(res), id));
  });

  return router;
}
