import type { DataSource } from 'typeorm';
import { conflict, forbidden, notFound, unauthorized, validationFailed } from '../errors.js';
import { Club } from '../entities/club.js';
import { ClubInvite } from '../entities/club-invite.js';
import { ClubMembership } from '../entities/club-membership.js';
import { User } from '../entities/user.js';
import type { Mailer } from '../mail/mailer.js';
import { clubInviteMail } from '../mail/templates/club-invite.js';
import { signUp } from './accounts.js';
import { newLinkToken, sha256Hex } from './secret-tokens.js';
import { returnedRows, type Db } from '../data-source.js';
import { enforceInviteQuota } from './invite-quota.js';

export const INVITE_VALID_DAYS = 7;
export const INVALID_INVITE_MESSAGE = 'This invite link is not valid, was used already, or has expired. Ask the organizer for a new one.';

/** Creates an invite and e-mails its single-use link; returns the invite row. */
export async function createInvite(
  ds: Db,
  mailer: Mailer,
  appUrl: string,
  input: { clubId: string; clubName: string; inviter: User; email: string },
): Promise<{ invite: ClubInvite; send: () => Promise<void> }> {
  const already: unknown[] = await ds.query(
    `SELECT 1 FROM club_memberships m JOIN users u ON u.id = m.user_id WHERE m.club_id = $1 AND u.email = $2`,
    [input.clubId, input.email],
  );
  if (already.length > 0) throw conflict('That person is already a member.', { email: 'That person is already a member.' });
  const token = newLinkToken();
  // The caps are counted and the invite written in one transaction, so parallel sends
  // (from any process) cannot all pass the count.
  const invite = await ds.transaction(async (tx) => {
    await enforceInviteQuota(tx, input.inviter.id, input.clubId);
    const repo = tx.getRepository(ClubInvite);
    return repo.save(
      repo.create({
        clubId: input.clubId,
        email: input.email,
        tokenHash: sha256Hex(token),
        invitedBy: input.inviter.id,
        expiresAt: new Date(Date.now() + INVITE_VALID_DAYS * 86_400_000),
        usedAt: null,
        revokedAt: null,
      }),
    );
  });
  const link = `${appUrl}/invite/${encodeURIComponent(token)}`;
  const content = clubInviteMail({ clubName: input.clubName, invitedBy: input.inviter.displayName, link, validDays: INVITE_VALID_DAYS });
  return { invite, send: () => mailer.send(input.email, content) };
}

/** An invite still waiting for an answer: not accepted, not revoked, not expired (the same rule as `liveInvite`). */
const PENDING_SQL = 'used_at IS NULL AND revoked_at IS NULL AND expires_at > now()';

async function liveInvite(ds: Db, token: string): Promise<ClubInvite | null> {
  const invite = await ds.getRepository(ClubInvite).findOneBy({ tokenHash: sha256Hex(token) });
  if (!invite || invite.usedAt || invite.revokedAt || invite.expiresAt.getTime() <= Date.now()) return null;
  return invite;
}

/** A club's invites still waiting for an answer (not accepted, expired or revoked), newest first. */
export interface PendingInviteRow {
  id: string;
  email: string;
  /** The sender's display name; null once their account is gone. */
  invited_by: string | null;
  created_at: Date;
  expires_at: Date;
}

export async function listPendingInvites(ds: DataSource, clubId: string): Promise<PendingInviteRow[]> {
  return ds.query(
    `SELECT i.id, i.email, u.display_name AS invited_by, i.created_at, i.expires_at
       FROM club_invites i LEFT JOIN users u ON u.id = i.invited_by
      WHERE i.club_id = $1 AND ${PENDING_SQL}
      ORDER BY i.created_at DESC, i.id`,
    [clubId],
  );
}

/**
 * Takes back a pending invite of the club. Only a pending one can be revoked: another club's,
 * an accepted, an expired or an already revoked invite is 404 (so revoking twice is 404). One
 * conditional UPDATE, so a revoke racing an accept lets exactly one of them win.
 */
export async function revokeInvite(ds: DataSource, clubId: string, inviteId: string): Promise<void> {
  const result: unknown[] = await ds.query(
    `UPDATE club_invites SET revoked_at = now()
      WHERE id = $1 AND club_id = $2 AND ${PENDING_SQL}
      RETURNING id`,
    [inviteId, clubId],
  );
  const rows = returnedRows<{ id: string }>(result);
  if (rows.length === 0) throw notFound('No such invite: it was answered, has expired, or was taken back already.');
}

/** What the link holder sees before accepting; 404 for an unknown, used, expired or revoked token. */
export interface InviteOnShow {
  invite: ClubInvite;
  clubName: string;
  /** null once the sender's account is gone. */
  inviterName: string | null;
  accountExists: boolean;
}

export async function previewInvite(ds: DataSource, token: string): Promise<InviteOnShow> {
  const invite = await liveInvite(ds, token);
  if (!invite) throw notFound(INVALID_INVITE_MESSAGE);
  const club = await ds.getRepository(Club).findOneByOrFail({ id: invite.clubId });
  const inviter = await ds.getRepository(User).findOneBy({ id: invite.invitedBy });
  return {
    invite,
    clubName: club.name,
    inviterName: inviter?.displayName ?? null,
    accountExists: await ds.getRepository(User).existsBy({ email: invite.email }),
  };
}

export interface AcceptedInvite {
  userId: string;
  clubId: string;
  /** A new account was made for the invited address. */
  created: boolean;
}

/**
 * Accepts an invite: the signed-in user joins as a member when the invite was sent to their
 * address, or — signed out — a new account is
 * made for the invited address (the link proves it). The token is claimed with one conditional
 * UPDATE, so it works once even when two requests race. Returns the joining user's id.
 */
export async function acceptInvite(
  ds: Db,
  token: string,
  signedInUserId: string | null,
  newAccount: { displayName?: string; password?: string },
): Promise<AcceptedInvite> {
  const preview = await liveInvite(ds, token);
  if (!preview) throw notFound(INVALID_INVITE_MESSAGE);
  let userId = signedInUserId;
  let created = false;
  if (userId) {
    // The link is bound to the address it was sent to: a forwarded link does not let someone
    // else into the club.
    const me = await ds.getRepository(User).findOneBy({ id: userId });
    if (!me || me.email !== preview.email) {
      throw forbidden('This invite was sent to another e-mail address. Sign in with that address, or ask the organizer to invite yours.');
    }
  } else {
    if (await ds.getRepository(User).existsBy({ email: preview.email })) throw unauthorized('An account uses this e-mail: sign in, then open the link again.');
    const fields: Record<string, string> = {};
    if (!newAccount.displayName) fields.displayName = 'Enter a name.';
    if (!newAccount.password) fields.password = 'Choose a password.';
    if (Object.keys(fields).length) throw validationFailed(fields);
    const user = await signUp(ds, { email: preview.email, displayName: newAccount.displayName!, password: newAccount.password! });
    userId = user.id;
    created = true;
  }
  const joiningUserId = userId;
  const clubId = await ds.transaction(async (tx) => {
    const claimed: unknown[] = await tx.query(
      `UPDATE club_invites SET used_at = now() WHERE token_hash = $1 AND ${PENDING_SQL} RETURNING club_id`,
      [sha256Hex(token)],
    );
    const rows = returnedRows<{ club_id: string }>(claimed);
    const id = rows[0]?.club_id;
    if (!id) throw notFound(INVALID_INVITE_MESSAGE);
    const memberships = tx.getRepository(ClubMembership);
    if (!(await memberships.existsBy({ clubId: id, userId: joiningUserId }))) await memberships.insert({ clubId: id, userId: joiningUserId, role: 'member' });
    return id;
  });
  return { userId: joiningUserId, clubId, created };
}
