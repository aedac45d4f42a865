import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import { livestockCreateSchema, livestockPatchSchema } from '../../shared/schemas/tank.js';
import type { AppDeps } from '../deps.js';
import type { Livestock } from '../entities/livestock.js';
import { notFound } from '../errors.js';
import { currentUser } from '../middleware/require-auth.js';
import { validateBody, validBody } from '../middleware/validate.js';
import { requestDb } from '../middleware/request-db.js';
import { presentLivestock } from '../presenters/tank.js';
import { addLivestock, findOwnLivestock, removeLivestock, updateLivestock } from '../services/livestock.js';

const uuid = z.string().uuid();

/** /api/tanks/:id/livestock — mounted after auth and the tank-ownership check. */
export function livestockRouter({ dataSource: ds }: AppDeps): Router {
  const router = Router({ mergeParams: true });

  // The row must sit in this (own) tank; anything else is 404 before the body is read.
  const ownItem: RequestHandler = async (req, res, next) => {
    const id = uuid.safeParse(req.params.livestockId);
    const item = id.success ? await findOwnLivestock(ds, currentUser(req).id, String(req.params.id), id.data) : null;
    if (!item) throw notFound('No such animals in this tank.');
    res.locals.livestock = item;
    next();
  };
  const item = (res: { locals: Record<string, unknown> }) => res.locals.livestock as Livestock;

  router.post('/', validateBody(livestockCreateSchema), async (req, res) => {
    const created = await addLivestock(requestDb(req, ds), String(req.params.id), validBody(req, livestockCreateSchema));
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
