import { z } from 'zod';
import { scenarioSchema } from '../../simulation/scenario';

/** One step of a lesson's narrative. */
export const lessonStepSchema = z.strictObject({
  title: z.string().trim().min(1, 'Give the step a title.').max(80, 'Use at most 80 characters.'),
  body: z.string().trim().min(1, 'Write the step.').max(1200, 'Use at most 1200 characters.'),
});
export type LessonStep = z.infer<typeof lessonStepSchema>;

/** A lesson's title, summary and steps: one rule each, shared by creating and editing. */
export const lessonTitleFieldSchema = z.string({ error: 'Give the lesson a title.' }).trim().min(3, 'Use at least 3 characters.').max(120, 'Use at most 120 characters.');
export const lessonSummaryFieldSchema = z.string().trim().max(400, 'Use at most 400 characters.');
/** The most steps a lesson may have. */
export const LESSON_MAX_STEPS = 12;
export const lessonStepsFieldSchema = z.array(lessonStepSchema).min(1, 'Write at least one step.').max(LESSON_MAX_STEPS, `At most ${LESSON_MAX_STEPS} steps.`);

/** "single": one forecast; "compare": all at once (`scenario`) against staged (`stagedScenario`). */
export const lessonKindSchema = z.enum(['single', 'compare']);
export type LessonKind = z.infer<typeof lessonKindSchema>;

/**
 * POST /api/clubs/:clubId/lessons — mentors and organizers. Either a scenario in the engine's
 * format, or `fromShareId`: a plan shared with the club, turned into a scenario on the server.
 */
export const createLessonSchema = z
  .strictObject({
    title: lessonTitleFieldSchema,
    summary: lessonSummaryFieldSchema.default(''),
    kind: lessonKindSchema.default('single'),
    scenario: scenarioSchema.optional(),
    stagedScenario: scenarioSchema.optional(),
    fromShareId: z.string().uuid().optional(),
    steps: lessonStepsFieldSchema,
  })
  .superRefine((l, ctx) => {
    if ((l.scenario === undefined) === (l.fromShareId === undefined))
      ctx.addIssue({ code: 'custom', path: ['scenario'], message: 'Give a scenario, or a shared plan to start from (not both).' });
    if (l.kind === 'compare' && !l.stagedScenario)
      ctx.addIssue({ code: 'custom', path: ['stagedScenario'], message: 'A comparison needs the staged scenario too.' });
    if (l.kind === 'single' && l.stagedScenario)
      ctx.addIssue({ code: 'custom', path: ['stagedScenario'], message: 'Only comparison lessons have a staged scenario.' });
  });
export type CreateLessonInput = z.input<typeof createLessonSchema>;

/**
 * PATCH /api/lessons/:lessonId — the author or an organizer rewords a lesson: any of title,
 * summary and steps (the steps replace the old ones). The tank and timeline are not editable.
 */
export const updateLessonTextSchema = z
  .strictObject({
    title: lessonTitleFieldSchema.optional(),
    summary: lessonSummaryFieldSchema.optional(),
    steps: lessonStepsFieldSchema.optional(),
  })
  .refine((l) => l.title !== undefined || l.summary !== undefined || l.steps !== undefined, { message: 'Change the title, the summary or the steps.' });
export type UpdateLessonTextInput = z.input<typeof updateLessonTextSchema>;

export const lessonSummarySchema = z.object({
  id: z.string().uuid(),
  clubId: z.string().uuid(),
  clubName: z.string(),
  title: z.string(),
  summary: z.string(),
  kind: lessonKindSchema,
  authorName: z.string(),
});
export type LessonSummary = z.infer<typeof lessonSummarySchema>;
export const lessonListSchema = z.object({ lessons: z.array(lessonSummarySchema) });

/** What a lesson page needs to run the forecast in the browser; no ids beyond its own. */
export const lessonContentSchema = z.object({
  title: z.string(),
  summary: z.string(),
  kind: lessonKindSchema,
  authorName: z.string(),
  steps: z.array(lessonStepSchema),
  scenario: scenarioSchema,
  stagedScenario: scenarioSchema.nullable(),
});
export type LessonContent = z.infer<typeof lessonContentSchema>;

export const lessonDetailSchema = lessonContentSchema.extend({
  id: z.string().uuid(),
  clubId: z.string().uuid(),
  clubName: z.string(),
  /** The caller may edit, delete and share it. */
  canManage: z.boolean(),
});
export type LessonDetail = z.infer<typeof lessonDetailSchema>;
