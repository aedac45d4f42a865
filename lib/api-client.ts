import type { z } from 'zod';
import { apiErrorSchema, CSRF_HEADER, CSRF_HEADER_VALUE } from '@/shared/api-error';

/** Failure of an `/api` call, whatever went wrong: HTTP error, no network, or an unexpected body. */
export class ApiRequestError extends Error {
  /** HTTP status; 0 when no response arrived. */
  readonly status: number;
  /** The server's stable error id, or a client one: `network`, `bad_response`, `http_<status>`. */
  readonly code: string;
  /** Field path → message, for validation errors. */
  readonly fields: Readonly<Record<string, string>>;
  /** Seconds to wait before retrying (429 / 503), from `Retry-After` or `RateLimit-Reset`. */
  readonly retryAfterSeconds: number | null;

  constructor(init: {
    status: number;
    code: string;
    message: string;
    fields?: Record<string, string>;
    retryAfterSeconds?: number | null;
  }) {
    super(init.message);
    this.name = 'ApiRequestError';
    this.status = init.status;
    this.code = init.code;
    this.fields = init.fields ?? {};
    this.retryAfterSeconds = init.retryAfterSeconds ?? null;
  }
}

export const isApiRequestError = (e: unknown): e is ApiRequestError => e instanceof ApiRequestError;

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
const UNSAFE_METHODS: ReadonlySet<Method> = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export interface ApiRequestOptions<S extends z.ZodType | undefined> {
  method?: Method;
  /** Sent as JSON. */
  body?: unknown;
  /** Parses a successful body; leave out for routes that answer 204 / 202 without content. */
  schema?: S;
  signal?: AbortSignal;
}

type Result<S> = S extends z.ZodType ? z.infer<S> : void;

/** Seconds from `Retry-After` (delta-seconds or HTTP date) or `RateLimit-Reset` (seconds). */
export function parseRetryAfter(headers: Headers, now: number = Date.now()): number | null {
  const retryAfter = headers.get('retry-after');
  if (retryAfter !== null && retryAfter.trim() !== '') {
    const trimmed = retryAfter.trim();
    if (/^\d+$/.test(trimmed)) return Number(trimmed);
    const at = Date.parse(trimmed);
    if (!Number.isNaN(at)) return Math.max(0, Math.ceil((at - now) / 1000));
  }
  const reset = headers.get('ratelimit-reset');
  if (reset !== null && /^\d+$/.test(reset.trim())) return Number(reset.trim());
  return null;
}

const GENERIC_MESSAGES: Record<number, string> = {
  401: 'Please sign in again.',
  403: 'You do not have access to this.',
  404: 'We could not find that.',
  429: 'Too many attempts. Please wait a moment and try again.',
};

function genericMessage(status: number): string {
  if (GENERIC_MESSAGES[status]) return GENERIC_MESSAGES[status];
  if (status >= 500) return 'The server had a problem. Please try again in a moment.';
  return 'The request did not go through. Please try again.';
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text.trim() === '') return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

/** Turns a non-2xx response into an ApiRequestError, using the shared error body when present. */
export async function errorFromResponse(response: Response): Promise<ApiRequestError> {
  const parsed = apiErrorSchema.safeParse(await readJson(response));
  const retryAfterSeconds = parseRetryAfter(response.headers);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiRequestError({ status: response.status, code, message, fields, retryAfterSeconds });
  }
  return new ApiRequestError({
    status: response.status,
    code: `http_${response.status}`,
    message: genericMessage(response.status),
    retryAfterSeconds,
  });
}

/**
 * Calls a same-origin `/api` route: relative URL, session cookie, JSON in and out, the CSRF
 * header on unsafe methods. Resolves with the schema-parsed body; rejects with ApiRequestError.
 */
export async function apiRequest<S extends z.ZodType | undefined = undefined>(
  path: string,
  options: ApiRequestOptions<S> = {},
): Promise<Result<S>> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';
  if (UNSAFE_METHODS.has(method)) headers[CSRF_HEADER] = CSRF_HEADER_VALUE;

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      credentials: 'same-origin',
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (cause) {
    if (cause instanceof Error && cause.name === 'AbortError') throw cause;
    throw new ApiRequestError({
      status: 0,
      code: 'network',
      message: 'Could not reach Shoalshift. Check your connection and try again.',
    });
  }

  if (!response.ok) throw await errorFromResponse(response);
  if (!options.schema) return undefined as Result<S>;

  const parsed = options.schema.safeParse(await readJson(response));
  if (!parsed.success) {
    throw new ApiRequestError({
      status: response.status,
      code: 'bad_response',
      message: 'The server sent something this version of the app does not understand. Reload the page.',
    });
  }
  return parsed.data as Result<S>;
}
