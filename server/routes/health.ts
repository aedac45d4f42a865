import { Router } from 'express';
import type { AppDeps } from '../deps.js';
import { serviceUnavailable } from '../errors.js';

/** Liveness and readiness in one: 200 when the database answers, 503 when it does not. */
export function healthRouter({ dataSource: ds }: AppDeps): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const ok = await Promise.race([
      ds.query('SELECT 1').then(() => true, () => false),
      new Promise<boolean>((resolve) => setTimeout(resolve, 2_000, false).unref()),
    ]);
    if (!ok) throw serviceUnavailable();
    res.json({ status: 'ok' });
  });
  return router;
}
