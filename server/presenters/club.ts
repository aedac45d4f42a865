import type { ClubDetail, ClubShare, ClubSummary, SharedItemDetail } from '../../shared/schemas/club.js';
import type { ClubMembership } from '../entities/club-membership.js';
import type { ShareRow, SharedItemRows } from '../services/club-shares.js';
import type { MyClubRow } from '../services/clubs.js';
import { presentComment } from './comment.js';
import { presentPlan, presentTankDetail } from './tank.js';

/** One of the caller's clubs in their list. */
export function presentClubSummary(r: MyClubRow): ClubSummary {
  return { id: r.id, name: r.name, myRole: r.role, memberCount: Number(r.count) };
}

/** A club as its members see it: names and roles, never e-mail addresses. */
export function presentClub(membership: ClubMembership, members: ClubMembership[]): ClubDetail {
  return {
    id: membership.clubId,
    name: membership.club?.name ?? '',
    myRole: membership.role,
    members: members.map((m) => ({ userId: m.userId, displayName: m.user?.displayName ?? '', role: m.role })),
  };
}

/** An item shared with the club, as listed to `viewerId`. */
export function presentShare(r: ShareRow, viewerId: string): ClubShare {
  return {
    id: r.id,
    itemType: r.item_type,
    title: r.title ?? '',
    ownerName: r.owner_name,
    mine: r.owner_id === viewerId,
    commentCount: Number(r.comments),
    sharedAt: new Date(r.created_at).toISOString(),
  };
}

/**
 * A shared item for the club: the tank without its plans (they are not shared) or, for a shared
 * plan, the tank with that one plan.
 */
export function presentSharedItem(input: SharedItemRows, viewerId: string): SharedItemDetail {
  const tank = presentTankDetail({ ...input.rows, plans: input.plan ? [input.plan] : [] });
  return {
    share: presentShare(input.share, viewerId),
    tank,
    plan: input.plan ? presentPlan(input.plan) : null,
    scenario: input.scenario,
    comments: input.comments.map(presentComment),
  };
}
