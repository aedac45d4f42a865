import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { ApiRequestError, apiRequest, parseRetryAfter } from '@/lib/api-client';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '@/shared/api-error';

type FetchArgs = [input: string, init: RequestInit];

function mockFetch(response: Response | (() => Promise<Response>)) {
  const fn = vi.fn(async (..._args: FetchArgs) => (typeof response === 'function' ? response() : response));
  vi.stubGlobal('fetch', fn);
  return fn;
}

const json = (status: number, body: unknown, headers: Record<string, string> = {}) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json', ...headers } });

async function caught(p: Promise<unknown>): Promise<ApiRequestError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof ApiRequestError) return e;
    throw e;
  }
  throw new Error('expected the request to fail');
}

afterEach(() => vi.unstubAllGlobals());

describe('apiRequest, request shape', () => {
  it('sends GETs to the relative URL with same-origin credentials and no CSRF header', async () => {
    const fetch = mockFetch(json(200, { ok: true }));
    await apiRequest('/api/me', { schema: z.object({ ok: z.boolean() }) });
    const [url, init] = fetch.mock.calls[0];
    expect(url).toBe('/api/me');
    expect(init.method).toBe('GET');
    expect(init.credentials).toBe('same-origin');
    expect((init.headers as Record<string, string>)[CSRF_HEADER]).toBeUndefined();
    expect(init.body).toBeUndefined();
  });

  it.each(['POST', 'PUT', 'PATCH', 'DELETE'] as const)('adds the CSRF header to %s', async (method) => {
    const fetch = mockFetch(new Response(null, { status: 204 }));
    await apiRequest('/api/x', { method, body: { a: 1 } });
    const headers = fetch.mock.calls[0][1].headers as Record<string, string>;
    expect(headers[CSRF_HEADER]).toBe(CSRF_HEADER_VALUE);
    expect(headers['Content-Type']).toBe('application/json');
    expect(fetch.mock.calls[0][1].body).toBe('{"a":1}');
  });
});

describe('apiRequest, success', () => {
  it('returns the schema-parsed body', async () => {
    mockFetch(json(200, { n: 3, extra: 'dropped' }));
    await expect(apiRequest('/api/n', { schema: z.object({ n: z.number() }) })).resolves.toEqual({ n: 3 });
  });

  it('resolves undefined for a 204 when no schema is given', async () => {
    mockFetch(new Response(null, { status: 204 }));
    await expect(apiRequest('/api/auth/sign-out', { method: 'POST' })).resolves.toBeUndefined();
  });

  it('rejects a body that does not match the schema as bad_response, keeping the status', async () => {
    mockFetch(json(200, { n: 'three' }));
    const e = await caught(apiRequest('/api/n', { schema: z.object({ n: z.number() }) }));
    expect(e.code).toBe('bad_response');
    expect(e.status).toBe(200);
  });
});

describe('apiRequest, errors', () => {
  it('carries status, code, message and fields from the shared error body', async () => {
    mockFetch(
      json(409, {
        error: { code: 'email_taken', message: 'That e-mail already has an account.', fields: { email: 'Already used.' } },
      }),
    );
    const e = await caught(apiRequest('/api/auth/sign-up', { method: 'POST', body: {} }));
    expect(e).toBeInstanceOf(ApiRequestError);
    expect(e.status).toBe(409);
    expect(e.code).toBe('email_taken');
    expect(e.message).toBe('That e-mail already has an account.');
    expect(e.fields).toEqual({ email: 'Already used.' });
  });

  it('gives an empty fields map when the error body has none', async () => {
    mockFetch(json(401, { error: { code: 'unauthorized', message: 'Sign in first.' } }));
    const e = await caught(apiRequest('/api/me'));
    expect(e.fields).toEqual({});
    expect(e.retryAfterSeconds).toBeNull();
  });

  it('reads the wait time of a 429 from Retry-After', async () => {
    mockFetch(json(429, { error: { code: 'rate_limited', message: 'Slow down.' } }, { 'Retry-After': '120' }));
    const e = await caught(apiRequest('/api/auth/sign-in', { method: 'POST', body: {} }));
    expect(e.status).toBe(429);
    expect(e.retryAfterSeconds).toBe(120);
  });

  it('falls back to a generic message and http_<status> code for a non-JSON error page', async () => {
    mockFetch(new Response('<html>Bad gateway</html>', { status: 502, headers: { 'Content-Type': 'text/html' } }));
    const e = await caught(apiRequest('/api/tanks'));
    expect(e.status).toBe(502);
    expect(e.code).toBe('http_502');
    expect(e.message).toMatch(/server had a problem/);
  });

  it('falls back when a JSON error body has the wrong shape', async () => {
    mockFetch(json(400, { message: 'nope' }));
    const e = await caught(apiRequest('/api/tanks'));
    expect(e.code).toBe('http_400');
    expect(e.fields).toEqual({});
  });

  it('turns a failed fetch into a network error with status 0', async () => {
    mockFetch(() => Promise.reject(new TypeError('Failed to fetch')));
    const e = await caught(apiRequest('/api/me'));
    expect(e.status).toBe(0);
    expect(e.code).toBe('network');
  });

  it('lets an abort through unchanged so callers can ignore it', async () => {
    const abort = new DOMException('The operation was aborted.', 'AbortError');
    mockFetch(() => Promise.reject(abort));
    await expect(apiRequest('/api/me')).rejects.toBe(abort);
  });
});

describe('parseRetryAfter', () => {
  const h = (init: Record<string, string>) => new Headers(init);

  it('reads delta-seconds', () => {
    expect(parseRetryAfter(h({ 'Retry-After': '30' }))).toBe(30);
  });

  it('reads an HTTP date relative to now, rounding up', () => {
    const now = Date.parse('2025-03-01T10:00:00Z');
    expect(parseRetryAfter(h({ 'Retry-After': 'Sat, 01 Mar 2025 10:01:30 GMT' }), now)).toBe(90);
  });

  it('never answers a negative wait for a date in the past', () => {
    const now = Date.parse('2025-03-01T10:00:00Z');
    expect(parseRetryAfter(h({ 'Retry-After': 'Sat, 01 Mar 2025 09:00:00 GMT' }), now)).toBe(0);
  });

  it('falls back to RateLimit-Reset', () => {
    expect(parseRetryAfter(h({ 'RateLimit-Reset': '45' }))).toBe(45);
  });

  it('answers null when neither header is usable', () => {
    expect(parseRetryAfter(h({}))).toBeNull();
    expect(parseRetryAfter(h({ 'Retry-After': 'soon' }))).toBeNull();
  });
});
