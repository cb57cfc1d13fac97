import type { RequestHandler } from 'express';
import type { CurrentUser } from './auth-middleware';
import { AppError, forbidden } from './errors';

/** A read-only route a personal API token may reach, relative to /api (the list: server/features/tokens/token-routes.ts). */
export interface TokenRoute {
  route: string;
  path: RegExp;
}

/**
 * The owner of an active token, signed in with `via: 'token'`, or null when the token is unknown, revoked or its
 * owner deactivated; notes the token's use (server/features/tokens/tokens.service.ts `authenticateToken`).
 */
export type TokenAuthenticator = (secret: string) => Promise<CurrentUser | null>;

const READ_METHODS = new Set(['GET', 'HEAD']);

export function tokenMayReach(routes: readonly TokenRoute[], method: string, path: string): boolean {
  return READ_METHODS.has(method) && routes.some((r) => r.path.test(path));
}

const invalidToken = (res: Parameters<RequestHandler>[1]) => {
  res.set('WWW-Authenticate', 'Bearer error="invalid_token"');
  return new AppError(401, 'invalid_token', 'The API token is unknown or revoked.');
};

/**
 * `Authorization: Bearer <token>`: checks the route against the token routes first (403), then the token
 * (401 unknown, revoked or owner deactivated), and signs the request in as the token's owner with
 * `via: 'token'`. Cookies are ignored on such a request, so a token never borrows a session. Mounted
 * before the Origin check, so a token can never reach the state-changing path at all.
 */
export function bearerTokenMiddleware(options: { routes: readonly TokenRoute[]; authenticate: TokenAuthenticator }): RequestHandler {
  const { routes, authenticate } = options;
  return async (req, res, next) => {
    const header = req.get('authorization');
    // Other schemes (e.g. Basic from a proxy in front) are not ours to judge.
    if (header === undefined || !/^bearer\s/i.test(header)) return next();
    const match = /^Bearer[ ]+([A-Za-z0-9_-]{16,128})[ ]*$/i.exec(header);
    if (!READ_METHODS.has(req.method))
      return next(new AppError(403, 'token_read_only', 'API tokens are read-only: sign in to change anything.'));
    if (!tokenMayReach(routes, req.method, req.path)) {
      return next(forbidden(`API tokens reach only ${routes.map((r) => r.route).join(', ')}.`));
    }
    if (!match) return next(invalidToken(res));
    const user = await authenticate(match[1]);
    if (!user) return next(invalidToken(res));
    delete req.headers.cookie;
    res.locals.user = user;
    next();
  };
}
