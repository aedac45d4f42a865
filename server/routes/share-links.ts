import { Router } from 'express';
import { z } from 'zod';
import { createShareLinkSchema, shareableTypeSchema, type ShareLinkItem, type replayedShareLinkSchema } from '../../shared/schemas/share.js';
import type { AppDeps } from '../deps.js';
import { notFound } from '../errors.js';
import type { ShareLink } from '../entities/share-link.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { validateBody, validateQuery, validBody, validQuery } from '../middleware/validate.js';
import { requestDb, storeAnswerAs } from '../middleware/request-db.js';
import { createShareLink, listShareLinks, revokeShareLink, sharedView } from '../services/share-links.js';
import { idParam } from './params.js';

const listQuery = z.object({ itemType: shareableTypeSchema, itemId: z.string().uuid() });
const TOKEN = /^[A-Za-z0-9_-]{43}$/;

const present = (l: ShareLink, madeBy: string, userId: string): ShareLinkItem => ({
  id: l.id,
  itemType: l.itemType,
  createdAt: l.createdAt.toISOString(),
  expiresAt: l.expiresAt.toISOString(),
  revokedAt: l.revokedAt ? new Date(l.revokedAt).toISOString() : null,
  madeBy,
  mine: l.createdBy === userId,
});

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
    const replayed: z.infer<typeof replayedShareLinkSchema> = { ...present(link, user.displayName, user.id), url: null, urlShownOnce: true };
    storeAnswerAs(req, replayed);
    res.status(201).json({ ...present(link, user.displayName, user.id), url: `${config.appUrl}/s/${token}` });
  });

  router.get('/', auth, validateQuery(listQuery), async (req, res) => {
    const { itemType, itemId } = validQuery(req, listQuery);
    const userId = currentUser(req).id;
    res.json({ links: (await listShareLinks(ds, userId, itemType, itemId)).map(({ link, madeBy }) => present(link, madeBy, userId)) });
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
    const token = req.params.token;
    if (typeof token !== 'string' || !TOKEN.test(token)) throw notFound('This link does not work: it was revoked, has expired, or is mistyped.');
    res.json(await sharedView(ds, token));
  });
  return router;
}
