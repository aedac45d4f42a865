import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { preferenceKeys } from '@/lib/query-keys';
import { DEFAULT_PREFERENCES, preferencesSchema, type Preferences } from '@/shared/schemas/preferences';

/** Units change only on the settings screen, which updates the cache itself. */
export const PREFERENCES_STALE_MS = 10 * 60_000;

export function usePreferencesQuery() {
  return useQuery({
    queryKey: preferenceKeys.mine(),
    queryFn: ({ signal }) => apiRequest('/api/me/preferences', { schema: preferencesSchema, signal }),
    staleTime: PREFERENCES_STALE_MS,
  });
}

/** The person's units for display: the defaults until the first answer arrives. */
export function usePreferences(): Preferences {
  return usePreferencesQuery().data ?? DEFAULT_PREFERENCES;
}

export function useSavePreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (prefs: Preferences) => apiRequest('/api/me/preferences', { method: 'PUT', body: prefs, schema: preferencesSchema }),
    onSuccess: (saved) => queryClient.setQueryData(preferenceKeys.mine(), saved),
  });
}
