import { Router } from 'express';
import type { AppDeps } from '../deps.js';
import { engineCaller } from '../middleware/engine-caller.js';
import { requireAuth } from '../middleware/require-auth.js';
import { forecastPlan } from '../services/plan-forecasts.js';
import { ownPlanParam } from './params.js';

/** POST /plans/:planId/forecast: the saved plan's forecast, run on the engine pool and cached. */
export function forecastsRouter(deps: AppDeps): Router {
  const { dataSource: ds, config } = deps;
  const router = Router();
  router.post('/plans/:planId/forecast', requireAuth(ds, config), async (req, res) => {
    res.json(await forecastPlan(ds, await ownPlanParam(ds, req), engineCaller(req, res, deps)));
  });
  return router;
}
