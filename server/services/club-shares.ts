import type { DataSource } from 'typeorm';
import type { Db } from '../data-source.js';
import type { ClubRole } from '../../shared/schemas/auth.js';
import type { SharedItemType } from '../../shared/schemas/club.js';
import type { Scenario } from '../../simulation/scenario.js';
import { conflict, forbidden, notFound } from '../errors.js';
import { ClubMembership } from '../entities/club-membership.js';
import { ClubShare } from '../entities/club-share.js';
import { PlanComment } from '../entities/plan-comment.js';
import { Plan } from '../entities/plan.js';
import { Tank } from '../entities/tank.js';
import { scenarioFromPlanOrNull } from './scenario-from-plan.js';
import { getOwnTank, type TankDetailRows } from './tanks.js';

const SEES_ALL_SHARES: readonly ClubRole[] = ['organizer', 'mentor'];

/** True when the user owns the tank or the plan (through its tank). */
async function ownsItem(ds: Db, userId: string, itemType: SharedItemType, itemId: string): Promise<boolean> {
  if (itemType === 'tank') return ds.getRepository(Tank).existsBy({ id: itemId, ownerId: userId });
  const rows: unknown[] = await ds.query(`SELECT 1 FROM plans p JOIN tanks t ON t.id = p.tank_id WHERE p.id = $1 AND t.owner_id = $2`, [itemId, userId]);
  return rows.length > 0;
}

/** Shares one of the caller's own tanks or plans with the club; someone else's item is 404. */
export async function shareItem(ds: Db, clubId: string, userId: string, itemType: SharedItemType, itemId: string): Promise<ClubShare> {
  if (!(await ownsItem(ds, userId, itemType, itemId))) throw notFound(itemType === 'tank' ? 'No such tank.' : 'No such plan.');
  const repo = ds.getRepository(ClubShare);
  if (await repo.existsBy({ clubId, itemType, itemId })) throw conflict('This is already shared with the club.');
  return repo.save(repo.create({ clubId, ownerId: userId, itemType, itemId }));
}

/**
 * The share when the caller may see it: its owner always; organizers and mentors of its club.
 * Anyone else — including a plain member looking at another member's item — gets 404.
 */
export async function visibleShare(ds: Db, membership: ClubMembership, shareId: string): Promise<ClubShare> {
  const share = await ds.getRepository(ClubShare).findOneBy({ id: shareId, clubId: membership.clubId });
  if (!share || (share.ownerId !== membership.userId && !SEES_ALL_SHARES.includes(membership.role))) throw notFound('No such shared item.');
  return share;
}

/** A club share as listed: its item's title (null once the item is deleted) and comment count. */
export interface ShareRow {
  id: string;
  item_type: SharedItemType;
  title: string | null;
  owner_name: string;
  owner_id: string;
  comments: string;
  created_at: Date;
}

/** Items shared with the club that the caller may see, newest first; deleted items left out. */
export async function listShares(ds: Db, membership: ClubMembership): Promise<ShareRow[]> {
  const all = SEES_ALL_SHARES.includes(membership.role);
  const rows: ShareRow[] = await ds.query(
    `SELECT s.id, s.item_type, s.owner_id, u.display_name AS owner_name, s.created_at,
            COALESCE(t.name, p.name) AS title,
            (SELECT count(*) FROM plan_comments c WHERE c.share_id = s.id) AS comments
       FROM club_shares s
       JOIN users u ON u.id = s.owner_id
       LEFT JOIN tanks t ON s.item_type = 'tank' AND t.id = s.item_id
       LEFT JOIN plans p ON s.item_type = 'plan' AND p.id = s.item_id
      WHERE s.club_id = $1 AND ($2 OR s.owner_id = $3)
      ORDER BY s.created_at DESC`,
    [membership.clubId, all, membership.userId],
  );
  return rows.filter((r) => r.title !== null); // the item was deleted since
}

/** One share as listed to the caller; 404 when it is not (any more) in their list. */
async function listedShare(ds: Db, membership: ClubMembership, shareId: string): Promise<ShareRow> {
  const listed = (await listShares(ds, membership)).find((s) => s.id === shareId);
  if (!listed) throw notFound('No such shared item.');
  return listed;
}

/** Shares one of the caller's own tanks or plans with the club, as it is then listed. */
export async function shareWithClub(ds: Db, membership: ClubMembership, itemType: SharedItemType, itemId: string): Promise<ShareRow> {
  const share = await shareItem(ds, membership.clubId, membership.userId, itemType, itemId);
  return listedShare(ds, membership, share.id);
}

/** A shared item as the club sees it: the share, the tank, the plan and its scenario, the comments. */
export interface SharedItemRows {
  share: ShareRow;
  rows: TankDetailRows;
  plan: Plan | null;
  scenario: Scenario | null;
  comments: CommentRow[];
}

/** The shared item behind a share the caller may see; 404 when it or its tank is gone. */
export async function sharedItemDetail(ds: Db, membership: ClubMembership, shareId: string): Promise<SharedItemRows> {
  const share = await visibleShare(ds, membership, shareId);
  const { tankId, plan } = await loadSharedItem(ds, share);
  const rows = await getOwnTank(ds, share.ownerId, tankId);
  if (!rows) throw notFound('No such shared item.');
  const listed = await listedShare(ds, membership, share.id);
  return {
    share: listed,
    rows,
    plan,
    scenario: plan ? scenarioFromPlanOrNull(rows.tank, rows.livestock, plan) : null,
    comments: await listComments(ds, share),
  };
}

/** The shared tank or plan itself (its tank id for a plan), or 404 when it no longer exists. */
export async function loadSharedItem(ds: Db, share: ClubShare): Promise<{ tankId: string; plan: Plan | null }> {
  if (share.itemType === 'tank') {
    if (!(await ds.getRepository(Tank).existsBy({ id: share.itemId }))) throw notFound('No such shared item.');
    return { tankId: share.itemId, plan: null };
  }
  const plan = await ds.getRepository(Plan).findOneBy({ id: share.itemId });
  if (!plan) throw notFound('No such shared item.');
  return { tankId: plan.tankId, plan };
}

/** Stops sharing: the owner, or an organizer. */
export async function unshare(ds: DataSource, membership: ClubMembership, shareId: string): Promise<void> {
  const share = await visibleShare(ds, membership, shareId);
  if (share.ownerId !== membership.userId && membership.role !== 'organizer') throw forbidden('Only the owner or an organizer can stop sharing this.');
  await ds.getRepository(ClubShare).delete({ id: share.id });
}

/** A comment with its author's name and role in the club (null once they left it). */
export interface CommentRow {
  id: string;
  body: string;
  created_at: Date;
  author_name: string;
  role: ClubRole | null;
}

export async function listComments(ds: Db, share: ClubShare): Promise<CommentRow[]> {
  return ds.query(
    `SELECT c.id, c.body, c.created_at, u.display_name AS author_name, m.role
       FROM plan_comments c JOIN users u ON u.id = c.author_id
       LEFT JOIN club_memberships m ON m.user_id = c.author_id AND m.club_id = $2
      WHERE c.share_id = $1 ORDER BY c.created_at, c.id`,
    [share.id, share.clubId],
  );
}

/** Mentors and organizers comment on shared plans (tanks are shown, not discussed). */
export async function addComment(ds: Db, membership: ClubMembership, share: ClubShare, body: string): Promise<PlanComment> {
  if (!SEES_ALL_SHARES.includes(membership.role)) throw forbidden('Mentors and organizers comment on shared plans.');
  if (share.itemType !== 'plan') throw conflict('Comments are for shared plans.');
  const repo = ds.getRepository(PlanComment);
  return repo.save(repo.create({ shareId: share.id, authorId: membership.userId, body }));
}

/** Adds a comment and returns it as the thread lists it. */
export async function commentOnShare(ds: Db, membership: ClubMembership, share: ClubShare, body: string): Promise<CommentRow> {
  const comment = await addComment(ds, membership, share, body);
  const listed = (await listComments(ds, share)).find((c) => c.id === comment.id);
  if (!listed) throw notFound('No such shared item.');
  return listed;
}
