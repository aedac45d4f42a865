import compression from 'compression';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { AppDeps } from './deps.js';
import { errorHandler, notFound } from './errors.js';
import { noStore, requestGuards } from './middleware/request-guards.js';
import { authRouter } from './routes/auth.js';
import { clubsRouter } from './routes/clubs.js';
import { devRouter } from './routes/dev.js';
import { healthRouter } from './routes/health.js';
import { meRouter } from './routes/me.js';
import { tanksRouter } from './routes/tanks.js';
import { createSessionMiddleware } from './session.js';
import { staticSite } from './static-site.js';

/** JSON bodies are small here; anything larger is refused with 413. */
export const JSON_BODY_LIMIT = '100kb';

/** Builds the Express app (no listen: index.ts listens, tests use supertest). */
export function createApp(deps: AppDeps): Express & { sessionStore: { close(): void } } {
  const { config, logger } = deps;
  const app = express();
  app.disable('x-powered-by');
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

  const api = express.Router();
  api.use(noStore, requestGuards, express.json({ limit: JSON_BODY_LIMIT, type: 'application/json' }), sessionMiddleware);
  api.use('/health', healthRouter(deps));
  api.use('/auth', authRouter(deps));
  api.use('/me', meRouter(deps));
  api.use('/tanks', tanksRouter(deps));
  api.use('/clubs', clubsRouter(deps));
  if (config.env !== 'production' && config.mailFakeUrl) api.use('/dev', devRouter(deps));
  if (deps.extraApiRoutes) api.use(deps.extraApiRoutes);
  api.use((_req, _res, next) => next(notFound('No such API route.')));
  api.use(errorHandler(logger));
  app.use('/api', api);

  app.use(staticSite(config.staticDir));
  app.use(errorHandler(logger));

  return Object.assign(app, { sessionStore: store });
}
