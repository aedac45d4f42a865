import type { DataSource } from 'typeorm';
import type { ClubRole } from '../../shared/schemas/auth.js';
import { forbidden, notFound } from '../errors.js';
import { ClubMembership } from '../entities/club-membership.js';

/**
 * The caller's membership of a club when its role is one of `roles`. Someone outside the club
 * gets 404 (the club's existence is not revealed); a member without the role gets 403.
 */
export async function requireClubRole(
  ds: DataSource,
  userId: string,
  clubId: string,
  roles: readonly ClubRole[],
): Promise<ClubMembership> {
  const membership = await ds.getRepository(ClubMembership).findOne({ where: { clubId, userId }, relations: { club: true } });
  if (!membership) throw notFound('No such club.');
  if (!roles.includes(membership.role)) throw forbidden('Your role in this club does not allow this.');
  return membership;
}

/** All memberships of a club with their users, organizers first. */
export async function listClubMembers(ds: DataSource, clubId: string): Promise<ClubMembership[]> {
  const members = await ds.getRepository(ClubMembership).find({ where: { clubId }, relations: { user: true } });
  const rank: Record<ClubRole, number> = { organizer: 0, mentor: 1, member: 2 };
  return members.sort((a, b) => rank[a.role] - rank[b.role] || (a.user?.displayName ?? '').localeCompare(b.user?.displayName ?? ''));
}
