import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { clubKeys, lessonKeys } from '@/lib/query-keys';
import {
  acceptInviteResultSchema,
  clubDetailSchema,
  clubListSchema,
  clubShareListSchema,
  commentSchema,
  invitePreviewSchema,
  inviteSchema,
  pendingInviteListSchema,
  sharedItemDetailSchema,
} from '@/shared/schemas/club';

/** Club membership changes rarely and other people's actions are not pushed: refresh after 30 s. */
export const CLUB_STALE_MS = 30_000;

export function useClubList() {
  return useQuery({ queryKey: clubKeys.list(), queryFn: ({ signal }) => apiRequest('/api/clubs', { schema: clubListSchema, signal }), staleTime: CLUB_STALE_MS });
}

export function useClub(id: string) {
  return useQuery({
    queryKey: clubKeys.detail(id),
    queryFn: ({ signal }) => apiRequest(`/api/clubs/${encodeURIComponent(id)}`, { schema: clubDetailSchema, signal }),
    staleTime: CLUB_STALE_MS,
    enabled: id.length > 0,
  });
}

export function useClubShares(id: string) {
  return useQuery({
    queryKey: clubKeys.shares(id),
    queryFn: ({ signal }) => apiRequest(`/api/clubs/${encodeURIComponent(id)}/shares`, { schema: clubShareListSchema, signal }),
    staleTime: CLUB_STALE_MS,
    enabled: id.length > 0,
  });
}

export function useSharedItem(clubId: string, shareId: string) {
  return useQuery({
    queryKey: clubKeys.share(clubId, shareId),
    queryFn: ({ signal }) =>
      apiRequest(`/api/clubs/${encodeURIComponent(clubId)}/shares/${encodeURIComponent(shareId)}`, { schema: sharedItemDetailSchema, signal }),
    staleTime: CLUB_STALE_MS,
  });
}

export function useCreateClub() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => apiRequest('/api/clubs', { method: 'POST', body: { name }, schema: clubDetailSchema }),
    onSuccess: () => qc.invalidateQueries({ queryKey: clubKeys.all }),
  });
}

export function useInvite(clubId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (email: string) => apiRequest(`/api/clubs/${encodeURIComponent(clubId)}/invites`, { method: 'POST', body: { email }, schema: inviteSchema }),
    onSuccess: () => qc.invalidateQueries({ queryKey: clubKeys.invites(clubId) }),
  });
}

/** Invites of the club not answered yet (organizers only; others get 403, so pass `enabled`). */
export function usePendingInvites(clubId: string, enabled: boolean) {
  return useQuery({
    queryKey: clubKeys.invites(clubId),
    queryFn: ({ signal }) => apiRequest(`/api/clubs/${encodeURIComponent(clubId)}/invites`, { schema: pendingInviteListSchema, signal }),
    staleTime: CLUB_STALE_MS,
    enabled: enabled && clubId.length > 0,
  });
}

/** Takes back a pending invite; the list refreshes either way (a 404 means it was already gone). */
export function useRevokeInvite(clubId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (inviteId: string) => apiRequest(`/api/clubs/${encodeURIComponent(clubId)}/invites/${encodeURIComponent(inviteId)}`, { method: 'DELETE' }),
    onSettled: () => qc.invalidateQueries({ queryKey: clubKeys.invites(clubId) }),
  });
}

export function useSetRole(clubId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string; role: 'mentor' | 'member' }) =>
      apiRequest(`/api/clubs/${encodeURIComponent(clubId)}/members/${encodeURIComponent(userId)}`, { method: 'PUT', body: { role }, schema: clubDetailSchema }),
    onSuccess: (club) => qc.setQueryData(clubKeys.detail(clubId), club),
  });
}

export function useRemoveMember(clubId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => apiRequest(`/api/clubs/${encodeURIComponent(clubId)}/members/${encodeURIComponent(userId)}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: clubKeys.all }),
  });
}

export function useLeaveClub(clubId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest(`/api/clubs/${encodeURIComponent(clubId)}/leave`, { method: 'POST' }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: clubKeys.all });
      void qc.invalidateQueries({ queryKey: lessonKeys.all });
    },
  });
}

export function useAddComment(clubId: string, shareId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: string) =>
      apiRequest(`/api/clubs/${encodeURIComponent(clubId)}/shares/${encodeURIComponent(shareId)}/comments`, { method: 'POST', body: { body }, schema: commentSchema }),
    onSuccess: () => qc.invalidateQueries({ queryKey: clubKeys.share(clubId, shareId) }),
  });
}

/** An invite link's preview; a 404 means used, expired or mistyped. */
export function useInvitePreview(token: string) {
  return useQuery({
    queryKey: clubKeys.invite(token),
    queryFn: ({ signal }) => apiRequest(`/api/invites/${encodeURIComponent(token)}`, { schema: invitePreviewSchema, signal }),
    retry: false,
  });
}

export function useAcceptInvite(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { displayName?: string; password?: string }) =>
      apiRequest(`/api/invites/${encodeURIComponent(token)}/accept`, { method: 'POST', body, schema: acceptInviteResultSchema }),
    onSuccess: () => qc.invalidateQueries(),
  });
}
