import { Router } from 'express';
import type { AppDeps } from '../deps.js';
import { requireAuth } from '../middleware/require-auth.js';
import { forecastPlan } from '../services/plan-forecasts.js';
import { ownPlanParam } from './plans.js';

/** POST /plans/:id/forecast: the saved plan's forecast, run on the engine pool and cached. */
export function forecastsRouter({ dataSource: ds, config }: AppDeps): Router {
  const router = Router();
  router.post('/plans/:id/forecast', requireAuth(ds, config), async (req, res) => {
    res.json(await forecastPlan(ds, await ownPlanParam(ds, req)));
  });
  return router;
}
