import { Router } from 'express';
import { acceptInviteSchema } from '../../shared/schemas/club.js';
import type { AppDeps } from '../deps.js';
import { notFound } from '../errors.js';
import { clientAddress } from '../middleware/client-address.js';
import { validateBody, validBody } from '../middleware/validate.js';
import { requestDb } from '../middleware/request-db.js';
import { User } from '../entities/user.js';
import { enforceAttemptLimit } from '../services/attempt-limiter.js';
import { acceptInvite, INVALID_INVITE_MESSAGE, previewInvite } from '../services/invites.js';
import { startUserSession } from '../session.js';

/** Invite tokens are base64url of 32 bytes; anything else is not worth a database look-up. */
const TOKEN = /^[A-Za-z0-9_-]{43}$/;

/** /api/invites/:token — preview (no account needed) and accept. */
export function invitesRouter({ dataSource: ds, config, logger }: AppDeps): Router {
  const router = Router();
  const token = (raw: unknown) => {
    if (typeof raw !== 'string' || !TOKEN.test(raw)) throw notFound(INVALID_INVITE_MESSAGE);
    return raw;
  };

  router.get('/:token', async (req, res) => {
    res.json(await previewInvite(ds, token(req.params.token)));
  });

  router.post('/:token/accept', validateBody(acceptInviteSchema), async (req, res) => {
    const inviteToken = token(req.params.token);
    // A live session counts as signed in (same rules as requireAuth: the password not changed since).
    let signedIn: string | null = null;
    const { userId, createdAt } = req.session ?? {};
    if (userId && createdAt && Date.now() - createdAt <= config.session.absoluteSeconds * 1000) {
      const user = await ds.getRepository(User).findOneBy({ id: userId });
      if (user && user.passwordChangedAt.getTime() <= createdAt) signedIn = user.id;
    }
    // Signed out, accepting may create an account (a bcrypt hash): limited per address before
    // any work. A signed-in keeper's accept hashes nothing and is not counted.
    if (!signedIn) await enforceAttemptLimit({ dataSource: ds, config, logger }, 'invite-accept', { address: clientAddress(req) });
    const result = await acceptInvite(requestDb(req, ds), inviteToken, signedIn, validBody(req, acceptInviteSchema));
    if (result.created) await startUserSession(req, result.userId);
    logger.log('info', 'clubs.invite_accepted', { clubId: result.clubId, userId: result.userId, newAccount: result.created });
    res.status(result.created ? 201 : 200).json({ clubId: result.clubId, role: 'member' });
  });

  return router;
}
