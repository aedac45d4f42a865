import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { lessonKeys } from '@/lib/query-keys';
import { lessonDetailSchema, lessonListSchema, type CreateLessonInput, type UpdateLessonTextInput } from '@/shared/schemas/lesson';
import { createdShareLinkSchema, shareLinkListSchema, sharedViewSchema, type ShareableType } from '@/shared/schemas/share';

/** Lessons change only when a mentor edits them. */
export const LESSON_STALE_MS = 5 * 60_000;

export function useLessonList() {
  return useQuery({ queryKey: lessonKeys.list(), queryFn: ({ signal }) => apiRequest('/api/lessons', { schema: lessonListSchema, signal }), staleTime: LESSON_STALE_MS });
}

export function useLesson(id: string) {
  return useQuery({
    queryKey: lessonKeys.detail(id),
    queryFn: ({ signal }) => apiRequest(`/api/lessons/${encodeURIComponent(id)}`, { schema: lessonDetailSchema, signal }),
    staleTime: LESSON_STALE_MS,
    enabled: id.length > 0,
  });
}

/** A mentor or organizer creates a lesson in their club (POST /api/clubs/:clubId/lessons). */
export function useCreateLesson() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ clubId, input }: { clubId: string; input: CreateLessonInput }) =>
      apiRequest(`/api/clubs/${encodeURIComponent(clubId)}/lessons`, { method: 'POST', body: input, schema: lessonDetailSchema }),
    onSuccess: (lesson) => {
      qc.setQueryData(lessonKeys.detail(lesson.id), lesson);
      void qc.invalidateQueries({ queryKey: lessonKeys.list() });
    },
  });
}

/** The author or an organizer rewords a lesson (PATCH /api/lessons/:id): title, summary, steps. */
export function useUpdateLessonText(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateLessonTextInput) =>
      apiRequest(`/api/lessons/${encodeURIComponent(id)}`, { method: 'PATCH', body: input, schema: lessonDetailSchema }),
    onSuccess: (lesson) => {
      qc.setQueryData(lessonKeys.detail(lesson.id), lesson);
      // The list shows titles and summaries; a share link's public view shows the words too.
      void qc.invalidateQueries({ queryKey: lessonKeys.list() });
      void qc.invalidateQueries({ queryKey: [...lessonKeys.all, 'shared'] });
    },
  });
}

/** The public view behind a share link (no account). */
export function useSharedView(token: string) {
  return useQuery({
    queryKey: lessonKeys.shared(token),
    queryFn: ({ signal }) => apiRequest(`/api/share/${encodeURIComponent(token)}`, { schema: sharedViewSchema, signal }),
    staleTime: LESSON_STALE_MS,
    retry: false,
  });
}

// ---- Share links (a plan's owner or a lesson's manager) ---------------------------------------


const shareLinkKey = lessonKeys.links;

export function useShareLinks(itemType: ShareableType, itemId: string) {
  return useQuery({
    queryKey: shareLinkKey(itemType, itemId),
    queryFn: ({ signal }) =>
      apiRequest(`/api/share-links?itemType=${itemType}&itemId=${encodeURIComponent(itemId)}`, { schema: shareLinkListSchema, signal }),
  });
}

export function useCreateShareLink(itemType: ShareableType, itemId: string) {
  const qc = useQueryClient();
  return useMutation({
    /** Days the link works; left out, the server's default (SHARE_LINK_DEFAULT_DAYS). */
    mutationFn: (expiresInDays?: number) =>
      apiRequest('/api/share-links', { method: 'POST', body: { itemType, itemId, ...(expiresInDays ? { expiresInDays } : {}) }, schema: createdShareLinkSchema }),
    onSuccess: () => qc.invalidateQueries({ queryKey: shareLinkKey(itemType, itemId) }),
  });
}

export function useRevokeShareLink(itemType: ShareableType, itemId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (linkId: string) => apiRequest(`/api/share-links/${encodeURIComponent(linkId)}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: shareLinkKey(itemType, itemId) }),
  });
}
