import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { tankKeys } from '@/lib/query-keys';
import { calibrationAdviceResponseSchema, type calibrationBodySchema } from '@/shared/schemas/plan';
import { tankFitSchema } from '@/shared/schemas/tank-history';

const tankUrl = (id: string) => `/api/tanks/${encodeURIComponent(id)}`;

/** Runs "Fit to my tests"; the answer's fit is kept server-side, ready to apply. */
export function useCalibration(tankId: string) {
  return useMutation({
    mutationFn: (body: z.input<typeof calibrationBodySchema>) =>
      apiRequest(`${tankUrl(tankId)}/calibration`, { method: 'POST', body, schema: calibrationAdviceResponseSchema }),
  });
}

/** Applying or dropping a fit changes where every forecast of the tank starts: the tank page refreshes (plan forecasts key on it). */
export function useApplyFit(tankId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fitId: string) => apiRequest(`${tankUrl(tankId)}/fit`, { method: 'POST', body: { fitId }, schema: tankFitSchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: tankKeys.all }),
  });
}

export function useClearFit(tankId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest(`${tankUrl(tankId)}/fit`, { method: 'DELETE' }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: tankKeys.all }),
  });
}
