import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../deps.js';
import { notFound } from '../errors.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { presentClub } from '../presenters/club.js';
import { listClubMembers, requireClubRole } from '../services/clubs.js';

const clubId = z.string().uuid();

export function clubsRouter({ dataSource: ds, config }: AppDeps): Router {
  const router = Router();

  router.get('/:clubId', requireAuth(ds, config), async (req, res) => {
    const id = clubId.safeParse(req.params.clubId);
    if (!id.success) throw notFound('No such club.');
    const membership = await requireClubRole(ds, currentUser(req).id, id.data, ['organizer', 'mentor', 'member']);
    res.json(presentClub(membership, await listClubMembers(ds, id.data)));
  });

  return router;
}
