import compression from 'compression';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { AppDeps } from './deps.js';
import { errorHandler, notFound } from './errors.js';
import { createIdempotency } from './middleware/idempotency.js';
import { noStore, requestGuards } from './middleware/request-guards.js';
import { authRouter } from './routes/auth.js';
import { clubsRouter } from './routes/clubs.js';
import { commentsRouter } from './routes/comments.js';
import { invitesRouter } from './routes/invites.js';
import { clubLessonsRouter, lessonsRouter } from './routes/lessons.js';
import { shareLinksRouter, sharedViewRouter } from './routes/share-links.js';
import { unsubscribeConfirmRouter, unsubscribeRouter } from './routes/unsubscribe.js';
import { devRouter } from './routes/dev.js';
import { healthRouter } from './routes/health.js';
import { meRouter } from './routes/me.js';
import { preferencesRouter } from './routes/preferences.js';
import { tanksRouter } from './routes/tanks.js';
import { adviceRouter } from './routes/advice.js';
import { tankFitsRouter } from './routes/tank-fits.js';
import { forecastsRouter } from './routes/forecasts.js';
import { plansRouter } from './routes/plans.js';
import { configureEnginePool } from './workers/engine-pool.js';
import { createSessionMiddleware } from './session.js';
import { markNoRoute } from './request-log-labels.js';
import { staticSite } from './static-site.js';

/** JSON bodies are small here; anything larger is refused with 413. */
export const JSON_BODY_LIMIT = '100kb';

/** Builds the Express app (no listen: index.ts listens, tests use supertest). */
export function createApp(
  deps: AppDeps,
): Express & { sessionStore: { close(): void }; idempotency: { close(): Promise<void> } } {
  const { config, logger } = deps;
  configureEnginePool(config.engine);
  const app = express();
  app.disable('x-powered-by');
  // API answers are `no-store`, so a body hash per answer buys nothing (static files keep theirs).
  app.set('etag', false);
  app.set('trust proxy', config.trustProxy);

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          // react-native-web writes its styles at run time.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'object-src': ["'none'"],
          'base-uri': ["'none'"],
          'frame-ancestors': ["'none'"],
          'form-action': ["'self'"],
          ...(config.env === 'production' ? { 'upgrade-insecure-requests': [] } : {}),
        },
      },
      referrerPolicy: { policy: 'no-referrer' },
      frameguard: { action: 'deny' },
      crossOriginEmbedderPolicy: false,
    }),
  );
  app.use(compression());

  const { middleware: sessionMiddleware, store } = createSessionMiddleware(config, deps.sessionPool, logger);

  const idempotency = createIdempotency(config.databaseUrl, logger);

  const api = express.Router();
  api.use(noStore, requestGuards, express.json({ limit: JSON_BODY_LIMIT, type: 'application/json' }), sessionMiddleware);
  // Idempotency-Key on signed-in POST routes (server/middleware/idempotency.ts).
  api.use(idempotency.middleware);
  api.use('/health', healthRouter(deps));
  api.use('/auth', authRouter(deps));
  api.use('/me/preferences', preferencesRouter(deps));
  api.use('/me', meRouter(deps));
  // Plans, forecasts and advice: /tanks/:tankId/plans|advice/*|ensemble|calibration|capacity-test and /plans/*.
  api.use(plansRouter(deps), forecastsRouter(deps), adviceRouter(deps), tankFitsRouter(deps));
  api.use('/tanks', tanksRouter(deps));
  api.use('/clubs/:clubId/lessons', clubLessonsRouter(deps));
  api.use('/clubs/:clubId/shares/:shareId/comments', commentsRouter(deps));
  api.use('/clubs', clubsRouter(deps));
  api.use('/invites', invitesRouter(deps));
  api.use('/lessons', lessonsRouter(deps));
  api.use('/share-links', shareLinksRouter(deps));
  api.use('/share', sharedViewRouter(deps));
  api.use('/unsubscribe', unsubscribeRouter(deps));
  // Only with DEV_OUTBOX=on (refused in production); see routes/dev.ts.
  if (config.devOutbox) api.use('/dev', devRouter(deps));
  if (deps.extraApiRoutes) api.use(deps.extraApiRoutes);
  api.use((_req, res, next) => {
    markNoRoute(res);
    next(notFound('No such API route.'));
  });
  api.use(errorHandler(logger));
  // The unsubscribe confirmation is a plain HTML form post (see routes/unsubscribe.ts).
  app.use('/api/unsubscribe', noStore, unsubscribeConfirmRouter(deps));
  app.use('/api', api);

  app.use(staticSite(config.staticDir));
  app.use(errorHandler(logger));

  return Object.assign(app, { sessionStore: store, idempotency: { close: idempotency.close } });
}
