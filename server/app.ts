import { existsSync } from 'node:fs';
import path from 'node:path';
import express from 'express';
import helmet from 'helmet';
import type { AppContext } from './app-context';
import { originCheck, sessionMiddleware } from './common/auth-middleware';
import { bearerTokenMiddleware } from './common/bearer-token';
import { oldRouteAliases } from './common/old-routes';
import { apiNotFound, createErrorHandler } from './common/error-handler';
import { trustProxySetting } from './config/env';
import { authRoutes } from './features/auth/auth.routes';
import { healthRoutes } from './features/health/health.routes';
import { peopleRoutes } from './features/people/people.routes';
import { substanceRoutes } from './features/substances/substances.routes';
import { measurementSetRoutes } from './features/measurement-sets/measurement-sets.routes';
import { fitRoutes } from './features/fits/fits.routes';
import { mailRoutes } from './features/mail/mail.routes';
import { auditRoutes } from './features/audit/audit.routes';
import { followRoutes } from './features/follows/follows.routes';
import { parameterSetRoutes } from './features/parameter-sets/parameter-sets.routes';
import { simulationRoutes } from './features/simulations/simulations.routes';
import { catalogRoutes } from './features/catalog/catalog.routes';
import { tokenRoutes } from './features/tokens/tokens.routes';
import { TOKEN_ROUTES } from './features/tokens/token-routes';
import { authenticateToken } from './features/tokens/tokens.service';
import { preferenceRoutes } from './features/preferences/preferences.routes';
import { noticeRoutes } from './features/notices/notices.routes';
import { workbenchRoutes } from './features/workbench/workbench.routes';
import { pairSetRoutes } from './features/pair-sets/pair-sets.routes';
import { validationSuiteRoutes } from './features/validation-suite/validation-suite.routes';

export interface CreateAppOptions {
  /** Folder of the built client (vite build); when set, the server serves it with an SPA fallback. */
  clientDir?: string;
}

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApp(ctx: AppContext, options: CreateAppOptions = {}) {
  const app = express();
  app.disable('x-powered-by');
  // Read by sendView (server/common/respond.ts): answers parsed with their contracts, in tests.
  app.locals.checkResponses = ctx.env.CHECK_RESPONSES === '1';
  // Forwarding headers (X-Forwarded-For/-Host/-Proto) count only from the proxies TRUST_PROXY names; none by default.
  app.set('trust proxy', trustProxySetting(ctx.env.TRUST_PROXY));
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          upgradeInsecureRequests: null,
        },
      },
    }),
  );

  if (ctx.env.LOG_REQUESTS === '1') {
    // Method, path, status and time only: never bodies, cookies or query strings (they may carry secrets).
    app.use((req, res, next) => {
      const started = performance.now();
      res.on('finish', () => ctx.log(`${req.method} ${req.path} ${res.statusCode} ${(performance.now() - started).toFixed(0)}ms`));
      next();
    });
  }

  const api = express.Router();
  // Paths from before the vocabulary rename are re-addressed to their new names before anything else runs (old-routes.ts).
  api.use(oldRouteAliases);
  // API answers hold personal data and change with every move: no browser or proxy may keep them.
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  api.use(express.json({ limit: '1mb' }));
  // Before the Origin check: a token request that is not a read of an allowed route stops here (403).
  api.use(bearerTokenMiddleware({ routes: TOKEN_ROUTES, authenticate: (secret) => authenticateToken(ctx.db, secret) }));
  api.use(originCheck);
  api.use(sessionMiddleware(ctx.auth, ctx.db));
  api.use(healthRoutes(ctx));
  api.use(authRoutes(ctx));
  api.use(peopleRoutes(ctx));
  api.use(substanceRoutes(ctx));
  api.use(measurementSetRoutes(ctx));
  api.use(fitRoutes(ctx));
  api.use(parameterSetRoutes(ctx));
  api.use(simulationRoutes(ctx));
  api.use(mailRoutes(ctx));
  api.use(auditRoutes(ctx));
  api.use(followRoutes(ctx));
  api.use(catalogRoutes(ctx));
  api.use(pairSetRoutes(ctx));
  api.use(tokenRoutes(ctx));
  api.use(preferenceRoutes(ctx));
  api.use(noticeRoutes(ctx));
  api.use(workbenchRoutes(ctx));
  api.use(validationSuiteRoutes(ctx));
  api.use(apiNotFound);
  app.use('/api', api);

  if (options.clientDir && existsSync(path.join(options.clientDir, 'index.html'))) {
    const clientDir = options.clientDir;
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(clientDir, 'index.html')));
  }

  app.use(createErrorHandler(ctx.log));
  return app;
}
