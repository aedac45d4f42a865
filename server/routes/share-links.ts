import { Router } from 'express';
import { z } from 'zod';
import { createShareLinkSchema, shareableTypeSchema } from '../../shared/schemas/share.js';
import type { AppDeps } from '../deps.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { validateBody, validateQuery, validBody, validQuery } from '../middleware/validate.js';
import { requestDb, storeAnswerAs } from '../middleware/request-db.js';
import { presentCreatedShareLink, presentReplayedShareLink, presentShareLink, presentSharedView } from '../presenters/share-link.js';
import { NO_SUCH_LINK, createShareLink, listShareLinks, revokeShareLink, sharedView } from '../services/share-links.js';
import { idParam, tokenParam } from './params.js';

const listQuery = z.object({ itemType: shareableTypeSchema, itemId: z.string().uuid() });

/**
 * /api/share-links — create, list and revoke read-only links (signed in). A lesson's links
 * are listed to, and revocable by, its club's organizers as well as their maker.
 */
export function shareLinksRouter({ dataSource: ds, config }: AppDeps): Router {
  const router = Router();
  const auth = requireAuth(ds, config);

  router.post('/', auth, validateBody(createShareLinkSchema), async (req, res) => {
    const user = currentUser(req);
    const { link, token } = await createShareLink(requestDb(req, ds), user.id, validBody(req, createShareLinkSchema));
    // The token goes to this answer only: a replay of the key gets the link without it.
    storeAnswerAs(req, presentReplayedShareLink(link, user));
    res.status(201).json(presentCreatedShareLink(link, user, `${config.appUrl}/s/${token}`));
  });

  router.get('/', auth, validateQuery(listQuery), async (req, res) => {
    const { itemType, itemId } = validQuery(req, listQuery);
    const userId = currentUser(req).id;
    res.json({ links: (await listShareLinks(ds, userId, itemType, itemId)).map(({ link, madeBy }) => presentShareLink(link, madeBy, userId)) });
  });

  router.delete('/:linkId', auth, async (req, res) => {
    await revokeShareLink(ds, currentUser(req).id, idParam(req, 'linkId', 'link'));
    res.status(204).end();
  });

  return router;
}

/** /api/share/:token — the read-only view; no account needed. */
export function sharedViewRouter({ dataSource: ds }: AppDeps): Router {
  const router = Router();
  router.get('/:token', async (req, res) => {
    res.json(presentSharedView(await sharedView(ds, tokenParam(req, 'token', NO_SUCH_LINK))));
  });
  return router;
}
