import { Router } from 'express';
import {
  additionAdviceBodySchema,
  calibrationBodySchema,
  capacityTestBodySchema,
  ensembleBodySchema,
  removalAdviceBodySchema,
  rescueAdviceBodySchema,
} from '../../shared/schemas/plan.js';
import type { AppDeps } from '../deps.js';
import { engineCaller } from '../middleware/engine-caller.js';
import { requireAuth } from '../middleware/require-auth.js';
import { validBody, validateBody } from '../middleware/validate.js';
import { additionAdvice, calibrationAdvice, capacityTestAdvice, ensembleAdvice, removalAdvice, rescueAdvice } from '../services/advice.js';
import { ownTankParam } from './params.js';
import { requestDb } from '../middleware/request-db.js';
import { presentCalibration } from '../presenters/tank-fit.js';

/** Advice, ensemble, calibration and capacity-test routes on a saved tank (mounted on /api). */
export function adviceRouter(deps: AppDeps): Router {
  const { dataSource: ds, config } = deps;
  const router = Router();
  const auth = requireAuth(ds, config);

  router.post('/tanks/:tankId/advice/addition', auth, validateBody(additionAdviceBodySchema), async (req, res) => {
    res.json(await additionAdvice(ds, await ownTankParam(ds, req), validBody(req, additionAdviceBodySchema), engineCaller(req, res, deps)));
  });
  router.post('/tanks/:tankId/advice/removal', auth, validateBody(removalAdviceBodySchema), async (req, res) => {
    res.json(await removalAdvice(ds, await ownTankParam(ds, req), validBody(req, removalAdviceBodySchema), engineCaller(req, res, deps)));
  });
  router.post('/tanks/:tankId/advice/rescue', auth, validateBody(rescueAdviceBodySchema), async (req, res) => {
    res.json(await rescueAdvice(ds, await ownTankParam(ds, req), validBody(req, rescueAdviceBodySchema), engineCaller(req, res, deps)));
  });
  router.post('/tanks/:tankId/ensemble', auth, validateBody(ensembleBodySchema), async (req, res) => {
    res.json(await ensembleAdvice(ds, await ownTankParam(ds, req), validBody(req, ensembleBodySchema), engineCaller(req, res, deps)));
  });
  router.post('/tanks/:tankId/calibration', auth, validateBody(calibrationBodySchema), async (req, res) => {
    res.json(presentCalibration(await calibrationAdvice(ds, requestDb(req, ds), await ownTankParam(ds, req), validBody(req, calibrationBodySchema), engineCaller(req, res, deps))));
  });
  router.post('/tanks/:tankId/capacity-test', auth, validateBody(capacityTestBodySchema), async (req, res) => {
    res.json(await capacityTestAdvice(ds, await ownTankParam(ds, req), validBody(req, capacityTestBodySchema), engineCaller(req, res, deps)));
  });

  return router;
}
