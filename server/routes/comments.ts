import { Router } from 'express';
import { createCommentSchema } from '../../shared/schemas/club.js';
import type { AppDeps } from '../deps.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { validateBody, validBody } from '../middleware/validate.js';
import { requestDb } from '../middleware/request-db.js';
import { presentComment } from '../presenters/comment.js';
import { commentOnShare, listComments, visibleShare } from '../services/club-shares.js';
import { requireClubRole } from '../services/clubs.js';
import { idParam } from './params.js';

/** /api/clubs/:clubId/shares/:shareId/comments — the owner reads; mentors and organizers also write. */
export function commentsRouter({ dataSource: ds, config }: AppDeps): Router {
  const router = Router({ mergeParams: true });
  const auth = requireAuth(ds, config);
  const load = async (req: Parameters<typeof currentUser>[0]) => {
    const membership = await requireClubRole(ds, currentUser(req).id, idParam(req, 'clubId', 'club'), ['organizer', 'mentor', 'member']);
    return { membership, share: await visibleShare(ds, membership, idParam(req, 'shareId', 'shared item')) };
  };

  router.get('/', auth, async (req, res) => {
    const { share } = await load(req);
    res.json({ comments: (await listComments(ds, share)).map(presentComment) });
  });

  router.post('/', auth, validateBody(createCommentSchema), async (req, res) => {
    const { membership, share } = await load(req);
    const comment = await commentOnShare(requestDb(req, ds), membership, share, validBody(req, createCommentSchema).body);
    res.status(201).json(presentComment(comment));
  });

  return router;
}
