import { Router } from 'express';
import { createdTokenView, tokenListView, tokenView } from '../../../shared/contracts/token';
import { createTokenBody } from '../../../shared/schemas/tokens';
import type { AppContext } from '../../app-context';
import { currentUser, requirePolicy } from '../../common/auth-middleware';
import { sendView } from '../../common/respond';
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
    sendView(res, createdTokenView, await createToken(db, currentUser(res), name), 201);
  });

  router.get('/tokens', requirePolicy('catalog:read'), async (_req, res) => {
    sendView(res, tokenListView, { tokens: await listTokens(db, currentUser(res).id) });
  });

  router.delete('/tokens/:id', requirePolicy('catalog:read'), async (req, res) => {
    const { id } = validParams(idParams, req);
    sendView(res, tokenView, await revokeToken(db, currentUser(res), id));
  });

  return router;
}
