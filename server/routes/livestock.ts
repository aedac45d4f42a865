import { Router, type Request, type RequestHandler } from 'express';
import { livestockCreateSchema, livestockPatchSchema } from '../../shared/schemas/tank.js';
import type { AppDeps } from '../deps.js';
import type { Livestock } from '../entities/livestock.js';
import { notFound } from '../errors.js';
import { currentUser } from '../middleware/require-auth.js';
import { validateBody, validBody } from '../middleware/validate.js';
import { requestDb } from '../middleware/request-db.js';
import { presentLivestock } from '../presenters/livestock.js';
import { addLivestock, findOwnLivestock, removeLivestock, updateLivestock } from '../services/livestock.js';
import { idParam, uuidParam } from './params.js';

const NO_SUCH_ITEM = 'No such animals in this tank.';
/** The tank `ownTank` (server/routes/tanks.ts) already checked. */
const tankIdOf = (req: Request) => idParam(req, 'tankId', 'tank');

/** /api/tanks/:tankId/livestock — mounted after auth and the tank-ownership check. */
export function livestockRouter({ dataSource: ds }: AppDeps): Router {
  const router = Router({ mergeParams: true });

  // The row must sit in this (own) tank; anything else is 404 before the body is read.
  const ownItem: RequestHandler = async (req, res, next) => {
    const item = await findOwnLivestock(ds, currentUser(req).id, tankIdOf(req), uuidParam(req, 'livestockId', NO_SUCH_ITEM));
    if (!item) throw notFound(NO_SUCH_ITEM);
    res.locals.livestock = item;
    next();
  };
  const item = (res: { locals: Record<string, unknown> }) => res.locals.livestock as Livestock;

  router.post('/', validateBody(livestockCreateSchema), async (req, res) => {
    const created = await addLivestock(requestDb(req, ds), tankIdOf(req), validBody(req, livestockCreateSchema));
    res.status(201).json(presentLivestock(created));
  });

  router.patch('/:livestockId', ownItem, validateBody(livestockPatchSchema), async (req, res) => {
    res.json(presentLivestock(await updateLivestock(ds, item(res), validBody(req, livestockPatchSchema))));
  });

  router.delete('/:livestockId', ownItem, async (_req, res) => {
    await removeLivestock(ds, item(res));
    res.status(204).end();
  });

  return router;
}
