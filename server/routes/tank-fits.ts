import { Router } from 'express';
import { applyFitSchema } from '../../shared/schemas/tank-history.js';
import type { AppDeps } from '../deps.js';
import { requireAuth } from '../middleware/require-auth.js';
import { requestDb } from '../middleware/request-db.js';
import { validBody, validateBody } from '../middleware/validate.js';
import { presentTankFit } from '../presenters/tank-fit.js';
import { applyFit, clearAppliedFit } from '../services/tank-fits.js';
import { ownTankParam } from './params.js';

/** A tank's applied fit (mounted on /api): apply the offered one, or stop using it. */
export function tankFitsRouter(deps: AppDeps): Router {
  const { dataSource: ds, config } = deps;
  const router = Router();
  const auth = requireAuth(ds, config);

  router.post('/tanks/:tankId/fit', auth, validateBody(applyFitSchema), async (req, res) => {
    const tank = await ownTankParam(ds, req);
    res.json(presentTankFit(await applyFit(requestDb(req, ds), tank, validBody(req, applyFitSchema).fitId)));
  });
  router.delete('/tanks/:tankId/fit', auth, async (req, res) => {
    await clearAppliedFit(ds, await ownTankParam(ds, req));
    res.status(204).end();
  });

  return router;
}
