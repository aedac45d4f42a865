import { Router } from 'express';
import { planCreateSchema, planPatchSchema } from '../../shared/schemas/plan.js';
import type { AppDeps } from '../deps.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { validBody, validateBody } from '../middleware/validate.js';
import { requestDb } from '../middleware/request-db.js';
import { presentPlanDetail } from '../presenters/plan.js';
import { createPlan, deletePlan, listOwnPlans, listTankPlans, updatePlan } from '../services/plans.js';
import { ownPlanParam, ownTankParam } from './params.js';

/** Plans CRUD: /tanks/:tankId/plans and /plans/:planId (mounted on /api). */
export function plansRouter({ dataSource: ds, config }: AppDeps): Router {
  const router = Router();
  const auth = requireAuth(ds, config);

  router.get('/plans', auth, async (req, res) => {
    const rows = await listOwnPlans(ds, currentUser(req).id);
    res.json({ plans: rows.map(presentPlanDetail) });
  });

  router.get('/tanks/:tankId/plans', auth, async (req, res) => {
    const tank = await ownTankParam(ds, req);
    res.json({ plans: (await listTankPlans(ds, tank)).map(presentPlanDetail) });
  });

  router.post('/tanks/:tankId/plans', auth, validateBody(planCreateSchema), async (req, res) => {
    const tank = await ownTankParam(ds, req);
    const plan = await createPlan(requestDb(req, ds), tank, validBody(req, planCreateSchema));
    res.status(201).json(presentPlanDetail({ plan, tank }));
  });

  router.get('/plans/:planId', auth, async (req, res) => {
    res.json(presentPlanDetail(await ownPlanParam(ds, req)));
  });

  router.patch('/plans/:planId', auth, validateBody(planPatchSchema), async (req, res) => {
    const own = await ownPlanParam(ds, req);
    const plan = await updatePlan(ds, own, validBody(req, planPatchSchema));
    res.json(presentPlanDetail({ plan, tank: own.tank }));
  });

  router.delete('/plans/:planId', auth, async (req, res) => {
    await deletePlan(ds, await ownPlanParam(ds, req));
    res.status(204).end();
  });

  return router;
}
