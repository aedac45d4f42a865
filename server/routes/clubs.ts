import { Router } from 'express';
import { createClubSchema, createInviteSchema, createShareSchema, memberRoleSchema } from '../../shared/schemas/club.js';
import type { AppDeps } from '../deps.js';
import { AppError } from '../errors.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { validateBody, validBody } from '../middleware/validate.js';
import { afterCommit, requestDb } from '../middleware/request-db.js';
import { presentClub, presentClubSummary, presentShare, presentSharedItem } from '../presenters/club.js';
import { presentCreatedInvite, presentPendingInvite } from '../presenters/invite.js';
import { listShares, shareWithClub, sharedItemDetail, unshare } from '../services/club-shares.js';
import { createClub, endMembership, listClubMembers, listMyClubs, removeMember, requireClubRole, setMemberRole } from '../services/clubs.js';
import { createInvite, listPendingInvites, revokeInvite } from '../services/invites.js';
import { idParam } from './params.js';

const ANY_ROLE = ['organizer', 'mentor', 'member'] as const;

/**
 * /api/clubs: clubs, members and roles, invites, items shared with the club. Every route loads
 * the caller's membership first: outside the club → 404, wrong role → 403.
 */
export function clubsRouter({ dataSource: ds, config, mailer, logger, background }: AppDeps): Router {
  const router = Router();
  const auth = requireAuth(ds, config);
  const member = (req: Parameters<typeof currentUser>[0], roles: readonly ('organizer' | 'mentor' | 'member')[] = ANY_ROLE) =>
    requireClubRole(ds, currentUser(req).id, idParam(req, 'clubId', 'club'), roles);

  router.get('/', auth, async (req, res) => {
    res.json({ clubs: (await listMyClubs(ds, currentUser(req).id)).map(presentClubSummary) });
  });

  router.post('/', auth, validateBody(createClubSchema), async (req, res) => {
    const db = requestDb(req, ds);
    const membership = await createClub(db, currentUser(req).id, validBody(req, createClubSchema).name);
    logger.log('info', 'clubs.created', { clubId: membership.clubId, userId: membership.userId });
    res.status(201).json(presentClub(membership, await listClubMembers(db, membership.clubId)));
  });

  router.get('/:clubId', auth, async (req, res) => {
    const membership = await member(req);
    res.json(presentClub(membership, await listClubMembers(ds, membership.clubId)));
  });

  router.post('/:clubId/invites', auth, validateBody(createInviteSchema), async (req, res) => {
    const membership = await member(req, ['organizer']);
    const { invite, send } = await createInvite(requestDb(req, ds), mailer, config.appUrl, {
      clubId: membership.clubId,
      clubName: membership.club?.name ?? '',
      inviter: currentUser(req),
      email: validBody(req, createInviteSchema).email,
    }).catch((err: unknown) => {
      if (err instanceof AppError && err.status === 429) logger.log('warn', 'clubs.invite_limited', { clubId: membership.clubId, userId: membership.userId });
      throw err;
    });
    // Once the invite is committed: a rolled-back attempt mails nothing, a replay mails nothing again.
    await afterCommit(req, () => background.run('club-invite-mail', send));
    res.status(201).json(presentCreatedInvite(invite));
  });

  router.get('/:clubId/invites', auth, async (req, res) => {
    const membership = await member(req, ['organizer']);
    res.json({ invites: (await listPendingInvites(ds, membership.clubId)).map(presentPendingInvite) });
  });

  // Only a pending invite can be revoked: revoking it again answers 404 (see revokeInvite).
  router.delete('/:clubId/invites/:inviteId', auth, async (req, res) => {
    const membership = await member(req, ['organizer']);
    const inviteId = idParam(req, 'inviteId', 'invite');
    await revokeInvite(ds, membership.clubId, inviteId);
    logger.log('info', 'clubs.invite_revoked', { clubId: membership.clubId, inviteId, userId: membership.userId });
    res.status(204).end();
  });

  router.put('/:clubId/members/:userId', auth, validateBody(memberRoleSchema), async (req, res) => {
    const membership = await member(req, ['organizer']);
    await setMemberRole(ds, membership.clubId, idParam(req, 'userId', 'member'), validBody(req, memberRoleSchema).role);
    res.json(presentClub(membership, await listClubMembers(ds, membership.clubId)));
  });

  router.delete('/:clubId/members/:userId', auth, async (req, res) => {
    const membership = await member(req, ['organizer']);
    await removeMember(ds, membership, idParam(req, 'userId', 'member'));
    res.status(204).end();
  });

  router.post('/:clubId/leave', auth, async (req, res) => {
    const membership = await member(req);
    await endMembership(requestDb(req, ds), membership.clubId, membership.userId);
    res.status(204).end();
  });

  router.get('/:clubId/shares', auth, async (req, res) => {
    const membership = await member(req);
    res.json({ shares: (await listShares(ds, membership)).map((row) => presentShare(row, membership.userId)) });
  });

  router.post('/:clubId/shares', auth, validateBody(createShareSchema), async (req, res) => {
    const membership = await member(req);
    const { itemType, itemId } = validBody(req, createShareSchema);
    const listed = await shareWithClub(requestDb(req, ds), membership, itemType, itemId);
    res.status(201).json(presentShare(listed, membership.userId));
  });

  router.get('/:clubId/shares/:shareId', auth, async (req, res) => {
    const membership = await member(req);
    res.json(presentSharedItem(await sharedItemDetail(ds, membership, idParam(req, 'shareId', 'shared item')), membership.userId));
  });

  router.delete('/:clubId/shares/:shareId', auth, async (req, res) => {
    await unshare(ds, await member(req), idParam(req, 'shareId', 'shared item'));
    res.status(204).end();
  });

  return router;
}
