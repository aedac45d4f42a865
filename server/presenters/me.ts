import type { Me } from '../../shared/schemas/auth.js';
import type { ClubMembership } from '../entities/club-membership.js';
import type { User } from '../entities/user.js';

/** The signed-in person as `/api/me` shows them: never the hash or internal timestamps. */
export function presentMe(user: User, memberships: ClubMembership[]): Me {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
    clubs: memberships
      .filter((m) => m.club)
      .map((m) => ({ id: m.clubId, name: m.club!.name, role: m.role })),
  };
}
