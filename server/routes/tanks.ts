import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import { tankCreateSchema, tankPatchSchema } from '../../shared/schemas/tank.js';
import type { AppDeps } from '../deps.js';
import { notFound } from '../errors.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { validateBody, validBody } from '../middleware/validate.js';
import { guardedMount } from '../request-log-labels.js';
import { requestDb } from '../middleware/request-db.js';
import { presentTankDetail, presentTankSummaryWithStatus } from '../presenters/tank.js';
import { createOwnTank, deleteOwnTank, findOwnTank, getOwnTank, listOwnTanks, updateOwnTank } from '../services/tanks.js';
import { livestockRouter } from './livestock.js';
import { readingsRouter } from './readings.js';

const tankId = z.string().uuid();

/**
 * The id of the tank in the path, when it parses. Another keeper's tank and a malformed id
 * look the same — 404 — so ids cannot be probed.
 */
export function tankIdParam(raw: unknown): string {
  const id = tankId.safeParse(raw);
  if (!id.success) throw notFound('No such tank.');
  return id.data;
}

/** 404 unless the signed-in person owns the tank in `:id`; nested routers run after it. */
function ownTank(deps: AppDeps): RequestHandler {
  return async (req, _res, next) => {
    const id = tankIdParam(req.params.id);
    const tank = await findOwnTank(deps.dataSource, currentUser(req).id, id);
    if (!tank) throw notFound('No such tank.');
    next();
  };
}

export function tanksRouter(deps: AppDeps): Router {
  const { dataSource: ds, config } = deps;
  const router = Router();
  const auth = requireAuth(ds, config);

  router.get('/', auth, async (req, res) => {
    const rows = await listOwnTanks(ds, currentUser(req).id);
    const now = new Date();
    res.json({ tanks: rows.map((row) => presentTankSummaryWithStatus(row, now)) });
  });

  router.post('/', auth, validateBody(tankCreateSchema), async (req, res) => {
    const user = currentUser(req);
    const db = requestDb(req, ds);
    const tank = await createOwnTank(db, user.id, validBody(req, tankCreateSchema));
    const rows = await getOwnTank(db, user.id, tank.id);
    res.status(201).location(`/api/tanks/${tank.id}`).json(presentTankDetail(rows!));
  });

  router.get('/:id', auth, async (req, res) => {
    const rows = await getOwnTank(ds, currentUser(req).id, tankIdParam(req.params.id));
    if (!rows) throw notFound('No such tank.');
    res.json(presentTankDetail(rows));
  });

  // Ownership before validation: another keeper's tank answers 404 whatever the body says.
  router.patch('/:id', auth, ownTank(deps), validateBody(tankPatchSchema), async (req, res) => {
    const user = currentUser(req);
    const id = tankIdParam(req.params.id);
    const tank = await updateOwnTank(ds, user.id, id, validBody(req, tankPatchSchema));
    if (!tank) throw notFound('No such tank.');
    res.json(presentTankDetail((await getOwnTank(ds, user.id, id))!));
  });

  router.delete('/:id', auth, async (req, res) => {
    if (!(await deleteOwnTank(ds, currentUser(req).id, tankIdParam(req.params.id)))) throw notFound('No such tank.');
    res.status(204).end();
  });

  // guardedMount: these guards are the nested routes' own (their refusals are logged as such).
  router.use('/:id/livestock', guardedMount, auth, ownTank(deps), livestockRouter(deps));
  router.use('/:id/readings', guardedMount, auth, ownTank(deps), readingsRouter(deps));

  return router;
}
