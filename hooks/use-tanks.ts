import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { tankKeys } from '@/lib/query-keys';
import {
  livestockSchema,
  tankDetailSchema,
  tankListWithStatusSchema,
  type LivestockCreateInput,
  type LivestockPatchInput,
  type TankCreateInput,
  type TankPatchInput,
} from '@/shared/schemas/tank';

/** The tank list changes when the keeper logs a test or edits a tank: refresh after 30 s. */
export const TANK_LIST_STALE_MS = 30_000;

export function useTankList() {
  return useQuery({
    queryKey: tankKeys.list(),
    queryFn: ({ signal }) => apiRequest('/api/tanks', { schema: tankListWithStatusSchema, signal }),
    staleTime: TANK_LIST_STALE_MS,
  });
}

/** A tank's page: refresh after 30 s, like the list, since both show the latest test. */
export const TANK_DETAIL_STALE_MS = 30_000;

const tankUrl = (id: string) => `/api/tanks/${encodeURIComponent(id)}`;

export function useTankDetail(id: string) {
  return useQuery({
    queryKey: tankKeys.detail(id),
    queryFn: ({ signal }) => apiRequest(tankUrl(id), { schema: tankDetailSchema, signal }),
    staleTime: TANK_DETAIL_STALE_MS,
    enabled: id.length > 0,
  });
}

/** Anything that changes a tank refreshes the list, the tank page and its test pages. */
function useInvalidateTanks() {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: tankKeys.all });
}

export function useCreateTank() {
  const invalidate = useInvalidateTanks();
  return useMutation({
    mutationFn: (input: TankCreateInput) => apiRequest('/api/tanks', { method: 'POST', body: input, schema: tankDetailSchema }),
    onSuccess: invalidate,
  });
}

export function useUpdateTank(id: string) {
  const invalidate = useInvalidateTanks();
  return useMutation({
    mutationFn: (patch: TankPatchInput) => apiRequest(tankUrl(id), { method: 'PATCH', body: patch, schema: tankDetailSchema }),
    onSuccess: invalidate,
  });
}

export function useDeleteTank(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest(tankUrl(id), { method: 'DELETE' }),
    onSuccess: () => {
      queryClient.removeQueries({ queryKey: tankKeys.detail(id) });
      return queryClient.invalidateQueries({ queryKey: tankKeys.list() });
    },
  });
}

export function useAddLivestock(tankId: string) {
  const invalidate = useInvalidateTanks();
  return useMutation({
    mutationFn: (input: LivestockCreateInput) =>
      apiRequest(`${tankUrl(tankId)}/livestock`, { method: 'POST', body: input, schema: livestockSchema }),
    onSuccess: invalidate,
  });
}

export function useUpdateLivestock(tankId: string) {
  const invalidate = useInvalidateTanks();
  return useMutation({
    mutationFn: ({ id, patch }: { id: string; patch: LivestockPatchInput }) =>
      apiRequest(`${tankUrl(tankId)}/livestock/${encodeURIComponent(id)}`, { method: 'PATCH', body: patch, schema: livestockSchema }),
    onSuccess: invalidate,
  });
}

export function useRemoveLivestock(tankId: string) {
  const invalidate = useInvalidateTanks();
  return useMutation({
    mutationFn: (id: string) => apiRequest(`${tankUrl(tankId)}/livestock/${encodeURIComponent(id)}`, { method: 'DELETE' }),
    onSuccess: invalidate,
  });
}
