import { useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { tankKeys } from '@/lib/query-keys';
import { tankDetailSchema, tankListSchema } from '@/shared/schemas/tank';

/** The tank list changes when the keeper logs a test or edits a tank: refresh after 30 s. */
export const TANK_LIST_STALE_MS = 30_000;

export function useTankList() {
  return useQuery({
    queryKey: tankKeys.list(),
    queryFn: ({ signal }) => apiRequest('/api/tanks', { schema: tankListSchema, signal }),
    staleTime: TANK_LIST_STALE_MS,
  });
}

/** A tank's page: refresh after 30 s, like the list, since both show the latest test. */
export const TANK_DETAIL_STALE_MS = 30_000;

export function useTankDetail(id: string) {
  return useQuery({
    queryKey: tankKeys.detail(id),
    queryFn: ({ signal }) => apiRequest(`/api/tanks/${encodeURIComponent(id)}`, { schema: tankDetailSchema, signal }),
    staleTime: TANK_DETAIL_STALE_MS,
    enabled: id.length > 0,
  });
}
