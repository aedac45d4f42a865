import type { DataSource } from 'typeorm';
import type { Db } from '../data-source.js';
import type { ClubRole } from '../../shared/schemas/auth.js';
import type { z } from 'zod';
import type { updateLessonTextSchema } from '../../shared/schemas/lesson.js';
import type { Scenario } from '../../simulation/scenario.js';
import { forbidden, notFound, validationFailed } from '../errors.js';
import { ClubMembership } from '../entities/club-membership.js';
import { Lesson } from '../entities/lesson.js';
import { Livestock } from '../entities/livestock.js';
import { Tank } from '../entities/tank.js';
import { loadSharedItem, visibleShare } from './club-shares.js';
import { scenarioFromPlanOrNull } from './scenario-from-plan.js';

export const LESSON_AUTHOR_ROLES: readonly ClubRole[] = ['organizer', 'mentor'];

export interface LessonInput {
  title: string;
  summary: string;
  kind: 'single' | 'compare';
  scenario?: Scenario;
  stagedScenario?: Scenario;
  fromShareId?: string;
  steps: { title: string; body: string }[];
}

/** A shared plan (visible to the mentor) as a scenario; 404 when it is not visible. */
async function scenarioFromShare(ds: Db, membership: ClubMembership, shareId: string): Promise<Scenario> {
  const share = await visibleShare(ds, membership, shareId);
  const { tankId, plan } = await loadSharedItem(ds, share);
  if (!plan) throw notFound('Start a lesson from a shared plan, not a tank.');
  const tank = await ds.getRepository(Tank).findOneByOrFail({ id: tankId });
  const livestock = await ds.getRepository(Livestock).findBy({ tankId });
  const scenario = scenarioFromPlanOrNull(tank, livestock, plan);
  if (!scenario) throw validationFailed({ fromShareId: 'This plan cannot be forecast as it stands (check its tank and fish), so it cannot become a lesson.' });
  return scenario;
}

/** Mentors and organizers create lessons in their club. */
export async function createLesson(ds: Db, membership: ClubMembership, input: LessonInput): Promise<Lesson> {
  if (!LESSON_AUTHOR_ROLES.includes(membership.role)) throw forbidden('Mentors and organizers build lessons.');
  const scenario = input.scenario ?? (await scenarioFromShare(ds, membership, input.fromShareId!));
  const repo = ds.getRepository(Lesson);
  return repo.save(
    repo.create({
      clubId: membership.clubId,
      authorId: membership.userId,
      title: input.title,
      summary: input.summary,
      kind: input.kind,
      scenario,
      stagedScenario: input.stagedScenario ?? null,
      steps: input.steps,
    }),
  );
}

/** Lessons of every club the user belongs to. */
export interface LessonSummaryRow {
  id: string;
  club_id: string;
  club_name: string;
  title: string;
  summary: string;
  kind: 'single' | 'compare';
  /** null once the author's account is gone. */
  author_name: string | null;
}

export async function listLessons(ds: DataSource, userId: string): Promise<LessonSummaryRow[]> {
  return ds.query(
      `SELECT l.id, l.club_id, c.name AS club_name, l.title, l.summary, l.kind, u.display_name AS author_name
         FROM lessons l JOIN clubs c ON c.id = l.club_id
         JOIN club_memberships m ON m.club_id = l.club_id AND m.user_id = $1
         LEFT JOIN users u ON u.id = l.author_id
        ORDER BY c.name, l.created_at, l.id`,
      [userId],
    );
}

/** A lesson and the caller's membership of its club; 404 outside the club. */
export async function loadLesson(ds: Db, userId: string, lessonId: string): Promise<{ lesson: Lesson; membership: ClubMembership }> {
  const lesson = await ds.getRepository(Lesson).findOneBy({ id: lessonId });
  const membership = lesson ? await ds.getRepository(ClubMembership).findOne({ where: { clubId: lesson.clubId, userId }, relations: { club: true } }) : null;
  if (!lesson || !membership) throw notFound('No such lesson.');
  return { lesson, membership };
}

/** The author, or an organizer of the club, manages a lesson. */
export function canManageLesson(lesson: Lesson, membership: ClubMembership): boolean {
  return membership.role === 'organizer' || (membership.role === 'mentor' && lesson.authorId === membership.userId);
}

/** The author or an organizer rewords a lesson; others in the club get 403 (they can read it). */
export async function updateLessonText(ds: DataSource, lesson: Lesson, membership: ClubMembership, input: z.output<typeof updateLessonTextSchema>): Promise<Lesson> {
  if (!canManageLesson(lesson, membership)) throw forbidden('Only the lesson’s author or an organizer can edit it.');
  const changes: Partial<Pick<Lesson, 'title' | 'summary' | 'steps'>> = {};
  if (input.title !== undefined) changes.title = input.title;
  if (input.summary !== undefined) changes.summary = input.summary;
  if (input.steps !== undefined) changes.steps = input.steps.map((s) => ({ title: s.title, body: s.body }));
  await ds.getRepository(Lesson).update({ id: lesson.id }, changes);
  // Deleted meanwhile (by the other manager): the same answer as a lesson that never existed.
  const updated = await ds.getRepository(Lesson).findOneBy({ id: lesson.id });
  if (!updated) throw notFound('No such lesson.');
  return updated;
}

/** The author's display name; null once their account is gone. */
export async function authorName(ds: DataSource, lesson: Lesson): Promise<string | null> {
  if (!lesson.authorId) return null;
  const rows: { display_name: string }[] = await ds.query(`SELECT display_name FROM users WHERE id = $1`, [lesson.authorId]);
  return rows[0]?.display_name ?? null;
}

/** The author or an organizer deletes a lesson; others in the club get 403. */
export async function deleteLesson(ds: DataSource, lesson: Lesson, membership: ClubMembership): Promise<void> {
  if (!canManageLesson(lesson, membership)) throw forbidden('Only the lesson’s author or an organizer can delete it.');
  await ds.getRepository(Lesson).delete({ id: lesson.id });
}
