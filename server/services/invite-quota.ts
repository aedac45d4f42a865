import type { EntityManager } from 'typeorm';
import { tooManyRequests } from '../errors.js';

/**
 * Invite e-mails carry a club's name and its organizer's name to any address, so anyone who
 * makes a club could use them as a relay. Two caps over a sliding day bound that: per
 * organizer (across every club they run, so making more clubs does not help) and per club
 * (so several organizers of one club do not multiply it). Revoked and answered invites still
 * count: revoking and re-inviting is still sending. [practice] sized well above what a real
 * club sends in a day (a meeting's sign-up sheet), far below what spam needs.
 */
export const INVITE_LIMITS = {
  perOrganizerPerDay: 30,
  perClubPerDay: 20,
  windowHours: 24,
} as const;

const WINDOW_SQL = `created_at > now() - make_interval(hours => $2)`;

/** Seconds until the oldest invite of a full window leaves it. */
async function windowUse(tx: EntityManager, column: 'invited_by' | 'club_id', id: string): Promise<{ count: number; retryAfter: number }> {
  const [row]: { count: string; retry_after: number | null }[] = await tx.query(
    `SELECT count(*) AS count,
            EXTRACT(EPOCH FROM (min(created_at) + make_interval(hours => $2) - now()))::float8 AS retry_after
       FROM club_invites WHERE ${column} = $1 AND ${WINDOW_SQL}`,
    [id, INVITE_LIMITS.windowHours],
  );
  return { count: Number(row?.count ?? 0), retryAfter: row?.retry_after ?? 1 };
}

/**
 * Inside the invite's transaction, before its insert: waits for other sends of this organizer
 * and this club (transaction-scoped advisory locks, always organizer first, so two organizers
 * of one club cannot deadlock), then counts. Several server processes share the locks and the
 * rows, so the caps hold across them. Throws 429 with Retry-After when a cap is used up.
 */
export async function enforceInviteQuota(tx: EntityManager, inviterId: string, clubId: string): Promise<void> {
  await tx.query(`SELECT pg_advisory_xact_lock(hashtextextended('invite-quota:organizer:' || $1, 0))`, [inviterId]);
  await tx.query(`SELECT pg_advisory_xact_lock(hashtextextended('invite-quota:club:' || $1, 0))`, [clubId]);
  const mine = await windowUse(tx, 'invited_by', inviterId);
  if (mine.count >= INVITE_LIMITS.perOrganizerPerDay) {
    throw tooManyRequests(mine.retryAfter, `You have sent ${INVITE_LIMITS.perOrganizerPerDay} invites in the last day, the most allowed. Try again later.`);
  }
  const club = await windowUse(tx, 'club_id', clubId);
  if (club.count >= INVITE_LIMITS.perClubPerDay) {
    throw tooManyRequests(club.retryAfter, `This club has sent ${INVITE_LIMITS.perClubPerDay} invites in the last day, the most allowed. Try again later.`);
  }
}
