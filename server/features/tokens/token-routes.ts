import type { TokenRoute } from '../../common/bearer-token';

/**
 * The only routes a personal API token opens, read-only, relative to /api: this list is the whole policy.
 * Registered with bearerTokenMiddleware in server/app.ts. Express matches paths case-insensitively and
 * with an optional trailing slash, so these do too. Add a route only if it is read-only and meant for
 * scripts, and extend tests/api/tokens.test.ts.
 */
export const TOKEN_ROUTES: readonly TokenRoute[] = [
  { route: 'GET /api/catalog', path: /^\/catalog\/?$/i },
  { route: 'GET /api/catalog/:id', path: /^\/catalog\/[^/]+\/?$/i },
  { route: 'GET /api/parameter-sets/:id/export', path: /^\/parameter-sets\/[^/]+\/export\/?$/i },
  { route: 'GET /api/mixtures', path: /^\/mixtures\/?$/i },
  { route: 'GET /api/parameter-sets/:id/predictions', path: /^\/parameter-sets\/[^/]+\/predictions\/?$/i },
  { route: 'GET /api/schemas/:name', path: /^\/schemas\/[^/]+\/?$/i },
  { route: 'GET /api/openapi.json', path: /^\/openapi\.json\/?$/i },
];
