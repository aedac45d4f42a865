import { useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { devKeys } from '@/lib/query-keys';
import { outboxSchema } from '@/shared/schemas/outbox';

/** Developers wait on this page for a mail to arrive: poll every few seconds while it is open. */
export const OUTBOX_REFRESH_MS = 3_000;

export function useDevOutbox() {
  return useQuery({
    queryKey: devKeys.outbox(),
    queryFn: async ({ signal }) => (await apiRequest('/api/dev/outbox', { schema: outboxSchema, signal })).messages,
    refetchInterval: OUTBOX_REFRESH_MS,
    staleTime: 0,
  });
}
