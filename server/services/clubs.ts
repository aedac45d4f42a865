import type { DataSource } from 'typeorm';
import type { Db } from '../data-source.js';
import type { ClubRole } from '../../shared/schemas/auth.js';
import { conflict, forbidden, notFound } from '../errors.js';
import { Club } from '../entities/club.js';
import { ClubShare } from '../entities/club-share.js';
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
export async function listClubMembers(ds: Db, clubId: string): Promise<ClubMembership[]> {
  const members = await ds.getRepository(ClubMembership).find({ where: { clubId }, relations: { user: true } });
  const rank: Record<ClubRole, number> = { organizer: 0, mentor: 1, member: 2 };
  return members.sort((a, b) => rank[a.role] - rank[b.role] || (a.user?.displayName ?? '').localeCompare(b.user?.displayName ?? ''));
}

// ---- Club administration (issue 6) -----------------------------------------------------------

const LAST_ORGANIZER_MESSAGE = 'A club needs an organizer: make someone else organizer first, or stay.';

/** Creates a club with the caller as its organizer. */
export async function createClub(ds: Db, userId: string, name: string): Promise<ClubMembership> {
  return ds.transaction(async (tx) => {
    const club = await tx.getRepository(Club).save(tx.getRepository(Club).create({ name }));
    await tx.getRepository(ClubMembership).insert({ clubId: club.id, userId, role: 'organizer' });
    return tx.getRepository(ClubMembership).findOneOrFail({ where: { clubId: club.id, userId }, relations: { club: true } });
  });
}

/** The caller's clubs with member counts, by name. */
/** A club of the caller's, with their role and the member count. */
export interface MyClubRow {
  id: string;
  name: string;
  role: ClubRole;
  count: string;
}

export async function listMyClubs(ds: DataSource, userId: string): Promise<MyClubRow[]> {
  return ds.query(
    `SELECT c.id, c.name, m.role, (SELECT count(*) FROM club_memberships x WHERE x.club_id = c.id) AS count
       FROM club_memberships m JOIN clubs c ON c.id = m.club_id
      WHERE m.user_id = $1 ORDER BY c.name`,
    [userId],
  );
}

/** Organizer grants or removes the mentor role. Organizers' own roles are not changed here. */
export async function setMemberRole(ds: DataSource, clubId: string, targetUserId: string, role: 'mentor' | 'member'): Promise<void> {
  const repo = ds.getRepository(ClubMembership);
  const target = await repo.findOneBy({ clubId, userId: targetUserId });
  if (!target) throw notFound('No such member.');
  if (target.role === 'organizer') throw conflict('An organizer keeps the organizer role.');
  await repo.update({ id: target.id }, { role });
}

/** An organizer removes someone else (leaving oneself is `endMembership` through Leave club). */
export async function removeMember(ds: Db, organizer: ClubMembership, userId: string): Promise<void> {
  if (userId === organizer.userId) throw conflict('To leave the club yourself, use Leave club.');
  await endMembership(ds, organizer.clubId, userId);
}

/**
 * Ends a membership (removed by an organizer, or leaving). The last organizer cannot go. The
 * member's items shared with the club stop being shared.
 */
export async function endMembership(ds: Db, clubId: string, userId: string): Promise<void> {
  await ds.transaction(async (tx) => {
    // Lock the club's memberships so two organizers cannot both leave at once.
    const all = await tx.getRepository(ClubMembership).createQueryBuilder('m').setLock('pessimistic_write').where('m.club_id = :clubId', { clubId }).getMany();
    const target = all.find((m) => m.userId === userId);
    if (!target) throw notFound('No such member.');
    if (target.role === 'organizer' && all.filter((m) => m.role === 'organizer').length === 1) throw conflict(LAST_ORGANIZER_MESSAGE);
    await tx.getRepository(ClubShare).delete({ clubId, ownerId: userId });
    await tx.getRepository(ClubMembership).delete({ id: target.id });
  });
}
