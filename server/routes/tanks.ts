import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps.js';
import { notFound } from '../errors.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { presentTankDetail, presentTankSummary } from '../presenters/tank.js';
import { getOwnTank, listOwnTanks } from '../services/tanks.js';

const tankId = z.string().uuid();

export function tanksRouter({ dataSource: ds, config }: AppDeps): Router {
  const router = Router();
  const auth = requireAuth(ds, config);

  router.get('/', auth, async (req, res) => {
    const rows = await listOwnTanks(ds, currentUser(req).id);
    res.json({ tanks: rows.map(presentTankSummary) });
  });

  router.get('/:id', auth, async (req, res) => {
    // Another keeper's tank and a malformed id look the same: 404, so ids cannot be probed.
    const id = tankId.safeParse(req.params.id);
    if (!id.success) throw notFound('No such tank.');
    const rows = await getOwnTank(ds, currentUser(req).id, id.data);
    if (!rows) throw notFound('No such tank.');
    res.json(presentTankDetail(rows));
  });

  return router;
}
