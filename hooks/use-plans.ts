import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { planKeys, tankKeys } from '@/lib/query-keys';
import {
  capacityTestResponseSchema,
  planDetailSchema,
  planForecastResponseSchema,
  planListSchema,
  planReadingsSchema,
  type PlanCreateInput,
  type PlanPatchInput,
  type PlanStartInput,
} from '@/shared/schemas/plan';
import { additionResponseSchema, removalResponseSchema, rescueResponseSchema } from '@/simulation/advice/schemas';
import type { z } from 'zod';
import type { additionAdviceBodySchema, capacityTestBodySchema, removalAdviceBodySchema, rescueAdviceBodySchema } from '@/shared/schemas/plan';

/** Plans change only through this app: a minute is fresh enough. */
export const PLAN_STALE_MS = 60_000;
/** A saved version's forecast never changes (the server caches it by its inputs). */
export const FORECAST_STALE_MS = Infinity;

const planUrl = (id: string) => `/api/plans/${encodeURIComponent(id)}`;
const tankUrl = (id: string) => `/api/tanks/${encodeURIComponent(id)}`;

export function usePlanList() {
  return useQuery({
    queryKey: planKeys.list(),
    queryFn: ({ signal }) => apiRequest('/api/plans', { schema: planListSchema, signal }),
    staleTime: PLAN_STALE_MS,
  });
}

export function usePlan(id: string) {
  return useQuery({
    queryKey: planKeys.detail(id),
    queryFn: ({ signal }) => apiRequest(planUrl(id), { schema: planDetailSchema, signal }),
    staleTime: PLAN_STALE_MS,
    enabled: id.length > 0,
  });
}

/** The server's forecast of the saved plan (`version` = its updatedAt), with the uncertainty band. */
export function usePlanForecast(id: string, version: string | undefined) {
  return useQuery({
    queryKey: planKeys.forecast(id, version ?? ''),
    queryFn: ({ signal }) => apiRequest(`${planUrl(id)}/forecast`, { method: 'POST', schema: planForecastResponseSchema, signal }),
    staleTime: FORECAST_STALE_MS,
    enabled: id.length > 0 && version !== undefined,
    retry: false,
  });
}

function useInvalidatePlans() {
  const queryClient = useQueryClient();
  return () => Promise.all([queryClient.invalidateQueries({ queryKey: planKeys.all }), queryClient.invalidateQueries({ queryKey: tankKeys.all })]);
}

export function useCreatePlan(tankId: string) {
  const invalidate = useInvalidatePlans();
  return useMutation({
    mutationFn: (input: PlanCreateInput) => apiRequest(`${tankUrl(tankId)}/plans`, { method: 'POST', body: input, schema: planDetailSchema }),
    onSuccess: invalidate,
  });
}

export function useUpdatePlan(id: string) {
  const queryClient = useQueryClient();
  const invalidate = useInvalidatePlans();
  return useMutation({
    mutationFn: (patch: PlanPatchInput) => apiRequest(planUrl(id), { method: 'PATCH', body: patch, schema: planDetailSchema }),
    onSuccess: (saved) => {
      queryClient.setQueryData(planKeys.detail(id), saved);
      return invalidate();
    },
  });
}

/** Starts a draft (day 0 = the keeper's today) or marks a running plan done. */
export function usePlanTransition(id: string) {
  const queryClient = useQueryClient();
  const invalidate = useInvalidatePlans();
  return useMutation({
    mutationFn: (action: { kind: 'start'; body: PlanStartInput } | { kind: 'finish' }) =>
      apiRequest(`${planUrl(id)}/${action.kind}`, { method: 'POST', body: action.kind === 'start' ? action.body : {}, schema: planDetailSchema }),
    onSuccess: (saved) => {
      queryClient.setQueryData(planKeys.detail(id), saved);
      return invalidate();
    },
  });
}

/** The tank's tests taken while the plan ran, oldest first (none for a draft). */
export function usePlanReadings(plan: { id: string; tankId: string; status: string } | undefined) {
  return useQuery({
    queryKey: tankKeys.planReadings(plan?.tankId ?? '', plan?.id ?? ''),
    queryFn: ({ signal }) => apiRequest(`${planUrl(plan!.id)}/readings`, { schema: planReadingsSchema, signal }),
    staleTime: PLAN_STALE_MS,
    enabled: plan !== undefined && plan.status !== 'draft',
  });
}

// ---- advice (POST, nothing cached on the client: each answer is for the choices sent) ----

export function useAdditionAdvice(tankId: string) {
  return useMutation({
    mutationFn: (body: z.input<typeof additionAdviceBodySchema>) =>
      apiRequest(`${tankUrl(tankId)}/advice/addition`, { method: 'POST', body, schema: additionResponseSchema }),
  });
}

export function useRemovalAdvice(tankId: string) {
  return useMutation({
    mutationFn: (body: z.input<typeof removalAdviceBodySchema>) =>
      apiRequest(`${tankUrl(tankId)}/advice/removal`, { method: 'POST', body, schema: removalResponseSchema }),
  });
}

export function useRescueAdvice(tankId: string) {
  return useMutation({
    mutationFn: (body: z.input<typeof rescueAdviceBodySchema>) =>
      apiRequest(`${tankUrl(tankId)}/advice/rescue`, { method: 'POST', body, schema: rescueResponseSchema }),
  });
}

export function useCapacityTest(tankId: string) {
  return useMutation({
    mutationFn: (body: z.input<typeof capacityTestBodySchema>) =>
      apiRequest(`${tankUrl(tankId)}/capacity-test`, { method: 'POST', body, schema: capacityTestResponseSchema }),
  });
}
