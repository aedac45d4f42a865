import { Router, type Request } from 'express';
import { z } from 'zod';
import { planCreateSchema, planPatchSchema } from '../../shared/schemas/plan.js';
import type { AppDeps } from '../deps.js';
import { notFound } from '../errors.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { validBody, validateBody } from '../middleware/validate.js';
import { requestDb } from '../middleware/request-db.js';
import { presentPlanDetail } from '../presenters/plan.js';
import { createPlan, deletePlan, findOwnPlan, listOwnPlans, listTankPlans, updatePlan, type OwnPlan } from '../services/plans.js';
import { findOwnTank } from '../services/tanks.js';
import type { DataSource } from 'typeorm';
import type { Tank } from '../entities/tank.js';

const uuid = z.string().uuid();

/** The keeper's own tank from `:tankId`; another keeper's, a missing one and a malformed id are all 404. */
export async function ownTankParam(ds: DataSource, req: Request): Promise<Tank> {
  const id = uuid.safeParse(req.params.tankId);
  const tank = id.success ? await findOwnTank(ds, currentUser(req).id, id.data) : null;
  if (!tank) throw notFound('No such tank.');
  return tank;
}

/** The keeper's own plan from `:id` (same 404 rule). */
export async function ownPlanParam(ds: DataSource, req: Request): Promise<OwnPlan> {
  const id = uuid.safeParse(req.params.id);
  const own = id.success ? await findOwnPlan(ds, currentUser(req).id, id.data) : null;
  if (!own) throw notFound('No such plan.');
  return own;
}

/** Plans CRUD: /tanks/:tankId/plans and /plans/:id (mounted on /api). */
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

  router.get('/plans/:id', auth, async (req, res) => {
    res.json(presentPlanDetail(await ownPlanParam(ds, req)));
  });

  router.patch('/plans/:id', auth, validateBody(planPatchSchema), async (req, res) => {
    const own = await ownPlanParam(ds, req);
    const plan = await updatePlan(ds, own, validBody(req, planPatchSchema));
    res.json(presentPlanDetail({ plan, tank: own.tank }));
  });

  router.delete('/plans/:id', auth, async (req, res) => {
    await deletePlan(ds, await ownPlanParam(ds, req));
    res.status(204).end();
  });

  return router;
}
