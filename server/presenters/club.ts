import type { ClubDetail, ClubShare, CommentItem, SharedItemDetail } from '../../shared/schemas/club.js';
import type { Scenario } from '../../simulation/scenario.js';
import type { ClubMembership } from '../entities/club-membership.js';
import type { Plan } from '../entities/plan.js';
import type { TankDetailRows } from '../services/tanks.js';
import { presentPlan, presentTankDetail } from './tank.js';

/** A club as its members see it: names and roles, never e-mail addresses. */
export function presentClub(membership: ClubMembership, members: ClubMembership[]): ClubDetail {
  return {
    id: membership.clubId,
    name: membership.club?.name ?? '',
    myRole: membership.role,
    members: members.map((m) => ({ userId: m.userId, displayName: m.user?.displayName ?? '', role: m.role })),
  };
}

export function presentShare(s: ClubShare): ClubShare {
  return { ...s };
}

/**
 * A shared item for the club: the tank without its plans (they are not shared) or, for a shared
 * plan, the tank with that one plan.
 */
export function presentSharedItem(input: { share: ClubShare; rows: TankDetailRows; plan: Plan | null; scenario: Scenario | null; comments: CommentItem[] }): SharedItemDetail {
  const tank = presentTankDetail({ ...input.rows, plans: input.plan ? [input.plan] : [] });
  return { share: input.share, tank, plan: input.plan ? presentPlan(input.plan) : null, scenario: input.scenario, comments: input.comments };
}
