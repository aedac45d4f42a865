import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiRequestError } from '@/lib/api-client';
import { sessionKeys } from '@/lib/query-keys';

/** Client errors will not fix themselves on retry; network and server errors might. */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiRequestError(error) && error.status >= 400 && error.status < 500) return false;
  // A body the app cannot read will read the same way next time.
  if (isApiRequestError(error) && error.code === 'bad_response') return false;
  return failureCount < 2;
}

/**
 * One QueryClient for the app. A 401 from any request means the session ended (expired, or
 * signed out in another tab): mark the person signed out so the app layout sends them to sign-in.
 */
export function createQueryClient(): QueryClient {
  const client: QueryClient = new QueryClient({
    defaultOptions: {
      queries: { retry: shouldRetry, refetchOnWindowFocus: true },
      mutations: { retry: false },
    },
    queryCache: new QueryCache({ onError: (error) => onUnauthorized(client, error) }),
    mutationCache: new MutationCache({ onError: (error) => onUnauthorized(client, error) }),
  });
  return client;
}

function onUnauthorized(client: QueryClient, error: unknown) {
  if (isApiRequestError(error) && error.status === 401 && client.getQueryData(sessionKeys.me()) != null) {
    client.setQueryData(sessionKeys.me(), null);
  }
}
