import { describe, expect, it } from 'vitest';
import { ApiRequestError } from '@/lib/api-client';
import { createQueryClient, shouldRetry } from '@/lib/query-client';
import { sessionKeys } from '@/lib/query-keys';

const err = (status: number, code = `http_${status}`) => new ApiRequestError({ status, code, message: 'x' });

describe('shouldRetry', () => {
  it('never retries client errors', () => {
    for (const status of [400, 401, 403, 404, 409, 429]) expect(shouldRetry(0, err(status))).toBe(false);
  });

  it('never retries a body the app could not read', () => {
    expect(shouldRetry(0, err(200, 'bad_response'))).toBe(false);
  });

  it('retries network and server errors twice', () => {
    expect(shouldRetry(0, err(0, 'network'))).toBe(true);
    expect(shouldRetry(1, err(503))).toBe(true);
    expect(shouldRetry(2, err(503))).toBe(false);
  });
});

describe('createQueryClient', () => {
  const me = { id: '00000000-0000-4000-8000-000000000001', email: 'k@example.org', displayName: 'K', role: 'user' as const, clubs: [] };

  it('marks the person signed out when any query answers 401', async () => {
    const client = createQueryClient();
    client.setQueryData(sessionKeys.me(), me);
    await client.fetchQuery({ queryKey: ['tanks', 'list'], queryFn: () => Promise.reject(err(401)) }).catch(() => undefined);
    expect(client.getQueryData(sessionKeys.me())).toBeNull();
  });

  it('leaves the session alone for other errors', async () => {
    const client = createQueryClient();
    client.setQueryData(sessionKeys.me(), me);
    await client.fetchQuery({ queryKey: ['tanks', 'list'], queryFn: () => Promise.reject(err(404)), retry: false }).catch(() => undefined);
    expect(client.getQueryData(sessionKeys.me())).toEqual(me);
  });
});
