import type { RequestHandler } from 'express';
import type { Lucia, Session } from 'lucia';
import { hasPolicy, refusalMessage, type Policy, type Role } from '../../shared/auth/roles';
import type { Db } from '../db/database';
import { AppError, forbidden, unauthorized } from './errors';

export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  /** Set when a personal API token signed the request in (server/common/bearer-token.ts). */
  via?: 'token';
  tokenId?: number;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      user?: CurrentUser;
      session?: Session;
    }
  }
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site request forgery guard: a state-changing request must carry an Origin header naming this site,
 * scheme, host and port alike. The site is what this server sees (req.protocol, req.host): X-Forwarded-Proto
 * and X-Forwarded-Host count only from a proxy that TRUST_PROXY names (Express's "trust proxy").
 * Browsers always send Origin on POST/PATCH/DELETE; scripts add it themselves.
 */
export const originCheck: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  if (!sameOrigin(req.get('origin'), req.protocol, req.host)) {
    return next(
      new AppError(403, 'origin_rejected', 'State-changing requests must come from this site (Origin header missing or foreign).'),
    );
  }
  next();
};

/** True when `origin` is exactly protocol://host (default ports and letter case normalised by URL). */
export function sameOrigin(origin: string | undefined, protocol: string, host: string | undefined): boolean {
  if (!origin || !host) return false;
  try {
    return new URL(origin).origin === new URL(`${protocol}://${host}`).origin;
  } catch {
    return false;
  }
}

/** What the session middleware needs of the session manager (built by createAuth in server/features/auth/auth.ts). */
export type SessionAuth = Pick<
  Lucia,
  'readSessionCookie' | 'validateSession' | 'createSessionCookie' | 'createBlankSessionCookie' | 'invalidateSession'
>;

/** Reads the session cookie, refreshes or clears it, and loads the user with their roles. */
export function sessionMiddleware(auth: SessionAuth, _db?: Db): RequestHandler {
  return async (req, res, next) => {
    const sessionId = auth.readSessionCookie(req.headers.cookie ?? '');
    if (!sessionId) return next();
    const { session, user } = await auth.validateSession(sessionId);
    if (!session) {
      res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
      return next();
    }
    if (session.fresh) res.append('Set-Cookie', auth.createSessionCookie(session.id).serialize());
    // The session lookup brought the person with their roles (server/features/auth/auth.ts): no further query.
    if (user.active !== 1) {
      await auth.invalidateSession(session.id);
      res.append('Set-Cookie', auth.createBlankSessionCookie().serialize());
      return next();
    }
    res.locals.session = session;
    res.locals.user = { id: user.id, email: user.email, name: user.name, roles: user.roles };
    next();
  };
}

export const requireUser: RequestHandler = (_req, res, next) => {
  next(res.locals.user ? undefined : unauthorized());
};

/** 401 without a session, 403 when none of the user's roles grants the policy. */
export function requirePolicy(policy: Policy): RequestHandler {
  return (_req, res, next) => {
    const user = res.locals.user;
    if (!user) return next(unauthorized());
    if (!hasPolicy(user.roles, policy)) return next(forbidden(refusalMessage(user.roles, policy)));
    next();
  };
}

/** The signed-in user; only call behind requireUser / requirePolicy. */
export function currentUser(res: { locals: { user?: CurrentUser } }): CurrentUser {
  if (!res.locals.user) throw unauthorized();
  return res.locals.user;
}
