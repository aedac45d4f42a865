import { Router } from 'express';
import { acceptInviteSchema } from '../../shared/schemas/club.js';
import type { AppDeps } from '../deps.js';
import { clientAddress } from '../middleware/client-address.js';
import { liveSessionUser } from '../middleware/require-auth.js';
import { validateBody, validBody } from '../middleware/validate.js';
import { requestDb } from '../middleware/request-db.js';
import { presentAcceptedInvite, presentInvitePreview } from '../presenters/invite.js';
import { enforceAttemptLimit } from '../services/attempt-limiter.js';
import { acceptInvite, INVALID_INVITE_MESSAGE, previewInvite } from '../services/invites.js';
import { startUserSession } from '../session.js';
import { tokenParam } from './params.js';

/** /api/invites/:token — preview (no account needed) and accept. */
export function invitesRouter({ dataSource: ds, config, logger }: AppDeps): Router {
  const router = Router();

  router.get('/:token', async (req, res) => {
    res.json(presentInvitePreview(await previewInvite(ds, tokenParam(req, 'token', INVALID_INVITE_MESSAGE))));
  });

  router.post('/:token/accept', validateBody(acceptInviteSchema), async (req, res) => {
    const token = tokenParam(req, 'token', INVALID_INVITE_MESSAGE);
    // A live session counts as signed in (same rules as requireAuth).
    const signedIn = (await liveSessionUser(ds, config, req))?.id ?? null;
    // Signed out, accepting may create an account (a bcrypt hash): limited per address before
    // any work. A signed-in keeper's accept hashes nothing and is not counted.
    if (!signedIn) await enforceAttemptLimit({ dataSource: ds, config, logger }, 'invite-accept', { address: clientAddress(req) });
    const result = await acceptInvite(requestDb(req, ds), token, signedIn, validBody(req, acceptInviteSchema));
    if (result.created) await startUserSession(req, result.userId);
    logger.log('info', 'clubs.invite_accepted', { clubId: result.clubId, userId: result.userId, newAccount: result.created });
    res.status(result.created ? 201 : 200).json(presentAcceptedInvite(result));
  });

  return router;
}
