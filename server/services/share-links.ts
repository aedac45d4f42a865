import { In, type DataSource } from 'typeorm';
import type { Db } from '../data-source.js';
import type { ShareableType } from '../../shared/schemas/share.js';
import type { Scenario } from '../../simulation/scenario.js';
import { notFound } from '../errors.js';
import { Lesson } from '../entities/lesson.js';
import { Livestock } from '../entities/livestock.js';
import { Plan } from '../entities/plan.js';
import { ShareLink } from '../entities/share-link.js';
import { Tank } from '../entities/tank.js';
import { ClubMembership } from '../entities/club-membership.js';
import { returnedRows } from '../data-source.js';
import { authorName, canManageLesson } from './lessons.js';
import { scenarioFromPlanOrNull } from './scenario-from-plan.js';
import { newLinkToken, sha256Hex } from './secret-tokens.js';

export const NO_SUCH_LINK = 'This link does not work: it was revoked, has expired, or is mistyped.';

/**
 * Whether the user may share the item now: the plan's tank owner, or a lesson's manager (its
 * mentor author or an organizer of its club). Asked on every view too, so a link stops working
 * when its maker loses that right (left the club, no longer a mentor, the plan moved).
 */
async function mayShare(ds: Db, userId: string, itemType: ShareableType, itemId: string): Promise<boolean> {
  if (itemType === 'plan') {
    const rows: unknown[] = await ds.query(`SELECT 1 FROM plans p JOIN tanks t ON t.id = p.tank_id WHERE p.id = $1 AND t.owner_id = $2`, [itemId, userId]);
    return rows.length > 0;
  }
  const lesson = await ds.getRepository(Lesson).findOneBy({ id: itemId });
  const membership = lesson ? await ds.getRepository(ClubMembership).findOneBy({ clubId: lesson.clubId, userId }) : null;
  return Boolean(lesson && membership && canManageLesson(lesson, membership));
}

/** 404 unless the user may share the item. */
export async function assertMayShare(ds: Db, userId: string, itemType: ShareableType, itemId: string): Promise<void> {
  if (!(await mayShare(ds, userId, itemType, itemId))) throw notFound(itemType === 'plan' ? 'No such plan.' : 'No such lesson.');
}

/** Creates a link that works for `expiresInDays` (default 30); returns the row and the token (shown once, never stored). */
export async function createShareLink(
  ds: Db,
  userId: string,
  input: { itemType: ShareableType; itemId: string; expiresInDays: number },
): Promise<{ link: ShareLink; token: string }> {
  await assertMayShare(ds, userId, input.itemType, input.itemId);
  const token = newLinkToken();
  const repo = ds.getRepository(ShareLink);
  const link = await repo.save(
    repo.create({
      tokenHash: sha256Hex(token),
      itemType: input.itemType,
      itemId: input.itemId,
      createdBy: userId,
      expiresAt: new Date(Date.now() + input.expiresInDays * 86_400_000),
      revokedAt: null,
    }),
  );
  return { link, token };
}

/** A link as its managers see it. */
export interface ManagedShareLink {
  link: ShareLink;
  madeBy: string;
}

/**
 * A lesson's links are the club's: its organizers may revoke any of them (SQL shared by list
 * and revoke). `$2` is the caller.
 */
const CLUB_ORGANIZER_OF_LESSON_SQL = `s.item_type = 'lesson' AND EXISTS (
    SELECT 1 FROM lessons l JOIN club_memberships m ON m.club_id = l.club_id
     WHERE l.id = s.item_id AND m.user_id = $2 AND m.role = 'organizer')`;

/**
 * The links to an item the caller manages, newest first: their own, and for a lesson every
 * link when the caller is an organizer of its club.
 */
export async function listShareLinks(ds: DataSource, userId: string, itemType: ShareableType, itemId: string): Promise<ManagedShareLink[]> {
  await assertMayShare(ds, userId, itemType, itemId);
  const rows: { id: string; made_by: string | null }[] = await ds.query(
    `SELECT s.id, u.display_name AS made_by FROM share_links s LEFT JOIN users u ON u.id = s.created_by
      WHERE s.item_id = $1 AND s.item_type = $3 AND (s.created_by = $2 OR ${CLUB_ORGANIZER_OF_LESSON_SQL})
      ORDER BY s.created_at DESC, s.id`,
    [itemId, userId, itemType],
  );
  const links = await ds.getRepository(ShareLink).findBy({ id: In(rows.map((r) => r.id)) });
  const byId = new Map(links.map((l) => [l.id, l]));
  return rows.flatMap((r) => (byId.has(r.id) ? [{ link: byId.get(r.id)!, madeBy: r.made_by ?? 'A former member' }] : []));
}

/**
 * Revokes a link: its maker, or — for a lesson's link — an organizer of the lesson's club.
 * Anyone else's link is 404. Revoking twice keeps the first time.
 */
export async function revokeShareLink(ds: DataSource, userId: string, linkId: string): Promise<void> {
  const result: unknown[] = await ds.query(
    `UPDATE share_links s SET revoked_at = COALESCE(s.revoked_at, now())
      WHERE s.id = $1 AND (s.created_by = $2 OR ${CLUB_ORGANIZER_OF_LESSON_SQL})
      RETURNING s.id`,
    [linkId, userId],
  );
  if (returnedRows(result).length === 0) throw notFound('No such link.');
}

/** What a live link shows: a plan (with its scenario, null when it cannot be forecast) or a lesson. */
export type SharedItem =
  | { itemType: 'plan'; plan: Plan; scenario: Scenario | null }
  | { itemType: 'lesson'; lesson: Lesson; authorName: string | null };

/** The item behind a live token, when its maker may still share it; 404 otherwise. */
export async function sharedView(ds: DataSource, token: string): Promise<SharedItem> {
  const link = await ds.getRepository(ShareLink).findOneBy({ tokenHash: sha256Hex(token) });
  if (!link || link.revokedAt || link.expiresAt.getTime() <= Date.now()) throw notFound(NO_SUCH_LINK);
  // The maker must still be allowed to share it: a link is their act, not a standing grant.
  if (!(await mayShare(ds, link.createdBy, link.itemType, link.itemId))) throw notFound(NO_SUCH_LINK);
  if (link.itemType === 'plan') {
    const plan = await ds.getRepository(Plan).findOneBy({ id: link.itemId });
    if (!plan) throw notFound(NO_SUCH_LINK);
    const tank = await ds.getRepository(Tank).findOneByOrFail({ id: plan.tankId });
    const livestock = await ds.getRepository(Livestock).findBy({ tankId: tank.id });
    return { itemType: 'plan', plan, scenario: scenarioFromPlanOrNull(tank, livestock, plan) };
  }
  const lesson = await ds.getRepository(Lesson).findOneBy({ id: link.itemId });
  if (!lesson) throw notFound(NO_SUCH_LINK);
  return { itemType: 'lesson', lesson, authorName: await authorName(ds, lesson) };
}
