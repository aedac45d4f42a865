import type { ClubRole } from '@/shared/schemas/auth';

/** Roles that build lessons (the server's LESSON_AUTHOR_ROLES: createLesson refuses the rest). */
export const LESSON_AUTHOR_ROLES: readonly ClubRole[] = ['organizer', 'mentor'];

/** The clubs where the person may build lessons; empty means no "New lesson" entry anywhere. */
export function lessonAuthorClubs<C extends { myRole: ClubRole }>(clubs: readonly C[]): C[] {
  return clubs.filter((c) => LESSON_AUTHOR_ROLES.includes(c.myRole));
}
