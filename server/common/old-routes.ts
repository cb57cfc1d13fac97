import type { RequestHandler } from 'express';

/**
 * API paths from before the vocabulary rename (DEVELOPERS.md, Vocabulary), answered by the routes of their new names:
 * the request is re-addressed before anything else looks at it, so roles, the token allow-list, the Origin check
 * and validation treat it exactly as a request to the new path. Answers use the new names. The rename script leaves
 * this file alone.
 */
export const OLD_ROUTES: ReadonlyArray<readonly [oldPrefix: RegExp, newPrefix: string]> = [
  [/^\/datasets(?=[/?]|$)/i, '/measurement-sets'],
  [/^\/simulations\/from-dataset(?=[/?]|$)/i, '/simulations/from-measurement-set'],
  [/^\/users(?=[/?]|$)/i, '/people'],
];

/** Mounted first on the /api router, so `req.url` is relative to /api. Case-insensitive, as Express routes are. */
export const oldRouteAliases: RequestHandler = (req, _res, next) => {
  for (const [oldPrefix, newPrefix] of OLD_ROUTES) {
    if (oldPrefix.test(req.url)) {
      req.url = req.url.replace(oldPrefix, newPrefix);
      break;
    }
  }
  next();
};
