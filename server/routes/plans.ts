import { Router } from 'express';
import { planCreateSchema, planFinishSchema, planPatchSchema, planStartSchema } from '../../shared/schemas/plan.js';
import type { AppDeps } from '../deps.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { validBody, validateBody } from '../middleware/validate.js';
import { requestDb } from '../middleware/request-db.js';
import { presentPlanDetail, presentPlanReadings } from '../presenters/plan.js';
import { createPlan, deletePlan, finishPlan, listOwnPlans, listTankPlans, planReadings, startPlan, updatePlan } from '../services/plans.js';
import { ownPlanParam, ownTankParam } from './params.js';

/** Plans CRUD: /tanks/:tankId/plans and /plans/:planId, and a plan's life: start, finish, its readings (mounted on /api). */
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

  router.post('/plans/:planId/start', auth, validateBody(planStartSchema), async (req, res) => {
    const own = await ownPlanParam(ds, req);
    const plan = await startPlan(requestDb(req, ds), own, validBody(req, planStartSchema), new Date());
    res.json(presentPlanDetail({ plan, tank: own.tank }));
  });

  router.post('/plans/:planId/finish', auth, validateBody(planFinishSchema), async (req, res) => {
    const own = await ownPlanParam(ds, req);
    const plan = await finishPlan(requestDb(req, ds), own, new Date());
    res.json(presentPlanDetail({ plan, tank: own.tank }));
  });

  router.get('/plans/:planId/readings', auth, async (req, res) => {
    res.json(presentPlanReadings(await planReadings(ds, await ownPlanParam(ds, req))));
  });

  router.delete('/plans/:planId', auth, async (req, res) => {
    await deletePlan(ds, await ownPlanParam(ds, req));
    res.status(204).end();
  });

  return router;
}
