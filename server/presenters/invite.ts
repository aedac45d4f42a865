import type { z } from 'zod';
import type { acceptInviteResultSchema, inviteSchema, InvitePreview, PendingInvite } from '../../shared/schemas/club.js';
import type { ClubInvite } from '../entities/club-invite.js';
import type { AcceptedInvite, InviteOnShow, PendingInviteRow } from '../services/invites.js';

/** Who sent an invite, when that organizer's account is gone. */
const FORMER_ORGANIZER = 'An organizer';

/** The answer to sending an invite: never the token or its hash. */
export function presentCreatedInvite(invite: ClubInvite): z.infer<typeof inviteSchema> {
  return { id: invite.id, email: invite.email, expiresAt: invite.expiresAt.toISOString() };
}

export function presentPendingInvite(r: PendingInviteRow): PendingInvite {
  return {
    id: r.id,
    email: r.email,
    invitedBy: r.invited_by ?? FORMER_ORGANIZER,
    createdAt: new Date(r.created_at).toISOString(),
    expiresAt: new Date(r.expires_at).toISOString(),
  };
}

/** What the link holder sees before accepting. */
export function presentInvitePreview({ invite, clubName, inviterName, accountExists }: InviteOnShow): InvitePreview {
  return { clubName, invitedBy: inviterName ?? FORMER_ORGANIZER, email: invite.email, expiresAt: invite.expiresAt.toISOString(), accountExists };
}

/** An accepted invite makes a plain member. */
export function presentAcceptedInvite(result: AcceptedInvite): z.infer<typeof acceptInviteResultSchema> {
  return { clubId: result.clubId, role: 'member' };
}
