import type { LessonContent, LessonDetail, LessonSummary } from '../../shared/schemas/lesson.js';
import type { ClubMembership } from '../entities/club-membership.js';
import type { Lesson } from '../entities/lesson.js';
import { canManageLesson, type LessonSummaryRow } from '../services/lessons.js';

/** A lesson's author whose account is gone. */
const FORMER_MENTOR = 'A former mentor';

export function presentLessonSummary(r: LessonSummaryRow): LessonSummary {
  return { id: r.id, clubId: r.club_id, clubName: r.club_name, title: r.title, summary: r.summary, kind: r.kind, authorName: r.author_name ?? FORMER_MENTOR };
}

/** What running the lesson needs, with no ids (also the read-only share-link view). */
export function presentLessonContent(lesson: Lesson, author: string | null): LessonContent {
  return {
    title: lesson.title,
    summary: lesson.summary,
    kind: lesson.kind,
    authorName: author ?? FORMER_MENTOR,
    steps: lesson.steps,
    scenario: lesson.scenario,
    stagedScenario: lesson.stagedScenario,
  };
}

/** A lesson as a member of its club sees it, with whether they may manage it. */
export function presentLessonDetail(lesson: Lesson, membership: ClubMembership, author: string | null): LessonDetail {
  return {
    id: lesson.id,
    clubId: lesson.clubId,
    clubName: membership.club?.name ?? '',
    ...presentLessonContent(lesson, author),
    canManage: canManageLesson(lesson, membership),
  };
}
