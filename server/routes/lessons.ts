import { Router } from 'express';
import { createLessonSchema, updateLessonTextSchema } from '../../shared/schemas/lesson.js';
import type { AppDeps } from '../deps.js';
import { currentUser, requireAuth } from '../middleware/require-auth.js';
import { validateBody, validBody } from '../middleware/validate.js';
import { requestDb } from '../middleware/request-db.js';
import { requireClubRole } from '../services/clubs.js';
import { presentLessonDetail, presentLessonSummary } from '../presenters/lesson.js';
import { LESSON_AUTHOR_ROLES, authorName, createLesson, deleteLesson, listLessons, loadLesson, updateLessonText } from '../services/lessons.js';
import { idParam } from './params.js';

/** /api/lessons: the lessons of the caller's clubs; read, reword, delete. */
export function lessonsRouter({ dataSource: ds, config }: AppDeps): Router {
  const router = Router();
  const auth = requireAuth(ds, config);

  router.get('/', auth, async (req, res) => {
    res.json({ lessons: (await listLessons(ds, currentUser(req).id)).map(presentLessonSummary) });
  });

  router.get('/:lessonId', auth, async (req, res) => {
    const { lesson, membership } = await loadLesson(ds, currentUser(req).id, idParam(req, 'lessonId', 'lesson'));
    res.json(presentLessonDetail(lesson, membership, await authorName(ds, lesson)));
  });

  // The words only (title, summary, steps); the scenario stays as built. Same rights as delete.
  router.patch('/:lessonId', auth, validateBody(updateLessonTextSchema), async (req, res) => {
    const { lesson, membership } = await loadLesson(ds, currentUser(req).id, idParam(req, 'lessonId', 'lesson'));
    const updated = await updateLessonText(ds, lesson, membership, validBody(req, updateLessonTextSchema));
    res.json(presentLessonDetail(updated, membership, await authorName(ds, updated)));
  });

  router.delete('/:lessonId', auth, async (req, res) => {
    const { lesson, membership } = await loadLesson(ds, currentUser(req).id, idParam(req, 'lessonId', 'lesson'));
    await deleteLesson(ds, lesson, membership);
    res.status(204).end();
  });

  return router;
}

/** /api/clubs/:clubId/lessons — mentors and organizers create a lesson in their club. */
export function clubLessonsRouter({ dataSource: ds, config }: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.post('/', requireAuth(ds, config), validateBody(createLessonSchema), async (req, res) => {
    const membership = await requireClubRole(ds, currentUser(req).id, idParam(req, 'clubId', 'club'), LESSON_AUTHOR_ROLES);
    const lesson = await createLesson(requestDb(req, ds), membership, validBody(req, createLessonSchema));
    res.status(201).json(presentLessonDetail(lesson, membership, currentUser(req).displayName));
  });
  return router;
}
