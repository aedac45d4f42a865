import type { ClubRole } from '@/shared/schemas/auth';

/** Role names as people read them. */
export const ROLE_LABEL: Record<ClubRole, string> = { organizer: 'Organizer', mentor: 'Mentor', member: 'Member' };
