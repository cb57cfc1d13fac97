import type { RequestHandler } from 'express';
import type { Db } from '../db/database';
import { findActiveToken, touchToken } from '../features/tokens/tokens.service';
import { rolesOf } from '../features/users/users.repository';
import { AppError, forbidden } from './errors';

/**
 * The only routes a personal API token opens, read-only, relative to /api. Every other route (and every
 * method but GET/HEAD) answers 403 to a token, before any route runs: this list is the whole policy.
 * Express matches paths case-insensitively and with an optional trailing slash, so these do too.
 */
export const TOKEN_ROUTES: ReadonlyArray<{ route: string; path: RegExp }> = [
  { route: 'GET /api/catalog', path: /^\/catalog\/?$/i },
  { route: 'GET /api/catalog/:id', path: /^\/catalog\/[^/]+\/?$/i },
  { route: 'GET /api/parameter-sets/:id/export', path: /^\/parameter-sets\/[^/]+\/export\/?$/i },
  { route: 'GET /api/mixtures', path: /^\/mixtures\/?$/i },
  { route: 'GET /api/parameter-sets/:id/predictions', path: /^\/parameter-sets\/[^/]+\/predictions\/?$/i },
  { route: 'GET /api/schemas/:name', path: /^\/schemas\/[^/]+\/?$/i },
  { route: 'GET /api/openapi.json', path: /^\/openapi\.json\/?$/i },
];

const READ_METHODS = new Set(['GET', 'HEAD']);

export function tokenMayReach(method: string, path: string): boolean {
  return READ_METHODS.has(method) && TOKEN_ROUTES.some((r) => r.path.test(path));
}

const invalidToken = (res: Parameters<RequestHandler>[1]) => {
  res.set('WWW-Authenticate', 'Bearer error="invalid_token"');
  return new AppError(401, 'invalid_token', 'The API token is unknown or revoked.');
};

/**
 * `Authorization: Bearer <token>`: checks the route against TOKEN_ROUTES first (403), then the token
 * (401 unknown, revoked or owner deactivated), and signs the request in as the token's owner with
 * `via: 'token'`. Cookies are ignored on such a request, so a token never borrows a session. Mounted
 * before the Origin check, so a token can never reach the state-changing path at all.
 */
export function bearerTokenMiddleware(db: Db): RequestHandler {
  return async (req, res, next) => {
    const header = req.get('authorization');
    // Other schemes (e.g. Basic from a proxy in front) are not ours to judge.
    if (header === undefined || !/^bearer\s/i.test(header)) return next();
    const match = /^Bearer[ ]+([A-Za-z0-9_-]{16,128})[ ]*$/i.exec(header);
    if (!READ_METHODS.has(req.method)) return next(new AppError(403, 'token_read_only', 'API tokens are read-only: sign in to change anything.'));
    if (!tokenMayReach(req.method, req.path)) {
      return next(forbidden(`API tokens reach only ${TOKEN_ROUTES.map((r) => r.route).join(', ')}.`));
    }
    if (!match) return next(invalidToken(res));
    const token = await findActiveToken(db, match[1]);
    if (!token || token.revokedAt !== null || token.active !== 1) return next(invalidToken(res));
    delete req.headers.cookie;
    res.locals.user = { id: token.userId, email: token.email, name: token.name, roles: await rolesOf(db, token.userId), via: 'token', tokenId: token.id };
    await touchToken(db, token.id, token.lastUsedAt);
    next();
  };
}
