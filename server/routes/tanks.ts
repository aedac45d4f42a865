import { Router, type Request, type RequestHandler } from 'express';
import { tankCreateSchema, tankPatchSchema } from '../../shared/schemas/tank.js';
import type { AppDeps } from '../deps.js';
import { notFound } from '../errors.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { validateBody, validBody } from '../middleware/validate.js';
import { guardedMount } from '../request-log-labels.js';
import { requestDb } from '../middleware/request-db.js';
import { presentTankDetail, presentTankSummaryWithStatus } from '../presenters/tank.js';
import { createOwnTank, deleteOwnTank, getOwnTank, listOwnTanks, updateOwnTank } from '../services/tanks.js';
import { livestockRouter } from './livestock.js';
import { readingsRouter } from './readings.js';
import { idParam, ownTankParam } from './params.js';

const tankIdOf = (req: Request) => idParam(req, 'tankId', 'tank');

/** 404 unless the signed-in person owns the tank in `:tankId`; nested routers run after it. */
function ownTank(deps: AppDeps): RequestHandler {
  return async (req, _res, next) => {
    await ownTankParam(deps.dataSource, req);
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

  router.get('/:tankId', auth, async (req, res) => {
    const rows = await getOwnTank(ds, currentUser(req).id, tankIdOf(req));
    if (!rows) throw notFound('No such tank.');
    res.json(presentTankDetail(rows));
  });

  // Ownership before validation: another keeper's tank answers 404 whatever the body says.
  router.patch('/:tankId', auth, ownTank(deps), validateBody(tankPatchSchema), async (req, res) => {
    const user = currentUser(req);
    const id = tankIdOf(req);
    const tank = await updateOwnTank(ds, user.id, id, validBody(req, tankPatchSchema));
    if (!tank) throw notFound('No such tank.');
    res.json(presentTankDetail((await getOwnTank(ds, user.id, id))!));
  });

  router.delete('/:tankId', auth, async (req, res) => {
    if (!(await deleteOwnTank(ds, currentUser(req).id, tankIdOf(req)))) throw notFound('No such tank.');
    res.status(204).end();
  });

  // guardedMount: these guards are the nested routes' own (their refusals are logged as such).
  router.use('/:tankId/livestock', guardedMount, auth, ownTank(deps), livestockRouter(deps));
  router.use('/:tankId/readings', guardedMount, auth, ownTank(deps), readingsRouter(deps));

  return router;
}
