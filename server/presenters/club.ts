import type { ClubDetail } from '../../shared/schemas/club.js';
import type { ClubMembership } from '../entities/club-membership.js';

/** A club as its members see it: names and roles, never e-mail addresses. */
export function presentClub(membership: ClubMembership, members: ClubMembership[]): ClubDetail {
  return {
    id: membership.clubId,
    name: membership.club?.name ?? '',
    myRole: membership.role,
    members: members.map((m) => ({ userId: m.userId, displayName: m.user?.displayName ?? '', role: m.role })),
  };
}
