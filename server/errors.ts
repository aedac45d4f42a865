import type { ErrorRequestHandler } from 'express';
import type { ApiError } from '../shared/api-error.js';
import type { Logger } from './logger.js';
import { matchedRoute, redactUrl } from './request-log-labels.js';

/**
 * The server's error vocabulary: each factory carries an HTTP status and a stable `code` the
 * app can branch on. Anything thrown that is not an AppError becomes a generic 500.
 */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
  }

  toBody(): ApiError {
    return { error: { code: this.code, message: this.message, ...(this.fields ? { fields: this.fields } : {}) } };
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) => new AppError(400, 'bad_request', message, fields);
export const validationFailed = (fields: Record<string, string>) =>
  new AppError(400, 'validation', 'Some fields need attention.', fields);
export const unauthorized = (message = 'Sign in to continue.') => new AppError(401, 'unauthorized', message);
export const invalidCredentials = () => new AppError(401, 'invalid_credentials', 'E-mail or password is wrong.');
export const forbidden = (message = 'You do not have access to this.') => new AppError(403, 'forbidden', message);
export const csrfRejected = (message = 'This request was refused because it did not come from the Shoalshift app.') =>
  new AppError(403, 'csrf', message);
export const notFound = (message = 'Not found.') => new AppError(404, 'not_found', message);
export const conflict = (message: string, fields?: Record<string, string>) => new AppError(409, 'conflict', message, fields);
/** A plan asked to move where its life does not go (start a finished plan, finish a draft…); the message says why. */
export const planStateRefused = (message: string, fields?: Record<string, string>) => new AppError(409, 'plan_state', message, fields);
export const unprocessable = (message: string) => new AppError(422, 'unprocessable', message);
export const payloadTooLarge = () => new AppError(413, 'payload_too_large', 'The request body is too large.');
export const unsupportedMediaType = (message = 'Send the request body as JSON (Content-Type: application/json).') =>
  new AppError(415, 'unsupported_media_type', message);
/** A file with more rows than one upload may hold (`fields` names the file). */
export const tooManyRows = (message: string, fields: Record<string, string>) => new AppError(422, 'too_many_rows', message, fields);
/** An import refused as a whole; `fields` names the rows at fault. */
export const importRejected = (message: string, fields: Record<string, string>) => new AppError(422, 'import_rejected', message, fields);
/** The same Idempotency-Key is still being answered (or its answer is not readable yet). */
export const idempotencyInProgress = (message = 'A request with this Idempotency-Key is still running. Retry shortly.') =>
  new AppError(409, 'in_progress', message, undefined, { 'Retry-After': '1' });
export const idempotencyKeyReused = () =>
  new AppError(422, 'idempotency_key_reused', 'This Idempotency-Key was already used for a different request.');
const ENGINE_SMALLER_REQUEST = 'Ask for fewer members, a shorter horizon or fewer repeated events.';
export const engineBusy = () =>
  new AppError(503, 'engine_busy', 'The forecast engine is busy. Try again in a few seconds.', undefined, { 'Retry-After': '5' });
export const engineTimeLimit = (taskMs: number) =>
  new AppError(
    422,
    'engine_time_limit',
    `This took longer than the ${Math.round(taskMs / 1000)} s the engine allows one request and was stopped. ${ENGINE_SMALLER_REQUEST}`,
  );
export const engineMemoryLimit = () =>
  new AppError(422, 'engine_memory_limit', `This needed more memory than the engine allows one request and was stopped. ${ENGINE_SMALLER_REQUEST}`);
export const tooManyRequests = (retryAfterSeconds: number, message = 'Too many attempts. Try again later.') =>
  new AppError(429, 'too_many_requests', message, undefined, { 'Retry-After': String(Math.max(1, Math.ceil(retryAfterSeconds))) });
export const serviceUnavailable = (retryAfterSeconds = 5) =>
  new AppError(503, 'unavailable', 'The service is briefly unavailable. Try again in a moment.', undefined, {
    'Retry-After': String(Math.max(1, Math.ceil(retryAfterSeconds))),
  });
export const internalError = () => new AppError(500, 'internal', 'Something went wrong on our side. Try again later.');

/** Errors raised by body-parser carry a `type`; map the ones a client can cause. */
function fromBodyParser(err: unknown): AppError | undefined {
  if (typeof err !== 'object' || err === null || !('type' in err)) return undefined;
  switch ((err as { type: unknown }).type) {
    case 'entity.too.large':
      return payloadTooLarge();
    case 'entity.parse.failed':
      return badRequest('The request body is not valid JSON.');
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return unsupportedMediaType();
    default:
      return undefined;
  }
}

/**
 * PostgreSQL unreachable, shutting down, every pooled connection busy (node-postgres: "timeout
 * exceeded when trying to connect"), or a statement past `statement_timeout` (57014): the
 * client may retry shortly.
 */
function isDatabaseUnavailable(err: unknown): boolean {
  if (typeof err !== 'object' || err === null) return false;
  const code = (err as { code?: unknown }).code;
  const message = String((err as { message?: unknown }).message ?? '');
  return (
    code === 'ECONNREFUSED' ||
    code === 'ECONNRESET' ||
    code === '57P01' || // admin_shutdown
    code === '57P03' || // cannot_connect_now
    code === '57014' || // query_canceled (statement_timeout)
    /Connection terminated|connection timeout|timeout exceeded when trying to connect|Driver not Connected/i.test(message)
  );
}

/** The one error handler: known errors as they are, anything else as a generic 500. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, next) => {
    if (res.headersSent) {
      // express-session reports a failed end-of-request save (database gone) after the answer
      // was written. Passing it on would make Express destroy the socket and cut off an answer
      // already sent; log it instead. An answer still incomplete is cut off as before.
      if (res.writableEnded) {
        logger.log('warn', 'request.error_after_answer', { method: req.method, error: err instanceof Error ? err.message : String(err) });
        return;
      }
      return next(err);
    }
    let appError = err instanceof AppError ? err : fromBodyParser(err);
    if (!appError) {
      appError = isDatabaseUnavailable(err) ? serviceUnavailable() : internalError();
      logger.log('error', 'request.failed', {
        method: req.method,
        path: redactUrl(req.originalUrl),
        error: err instanceof Error ? `${err.name}: ${err.message}` : String(err),
        stack: err instanceof Error ? err.stack : undefined,
      });
    }
    // ASVS 16.3.2: denied access is logged (path with ids and tokens hidden): every 401 and
    // 403, and a route's own 404 (another keeper's object answers 404, so ownership refusals
    // are 404s). `matched` is the route pattern whose guard answered, null when no route did.
    const matched = matchedRoute(req, res);
    if (appError.status === 401 || appError.status === 403 || (appError.status === 404 && matched)) {
      logger.log('warn', 'access.denied', {
        method: req.method,
        route: redactUrl(req.originalUrl.split('?')[0] ?? ''),
        matched,
        status: appError.status,
        code: appError.code,
        userId: (req as { session?: { userId?: string } }).session?.userId,
      });
    }
    if (appError.headers) res.set(appError.headers);
    res.status(appError.status).json(appError.toBody());
  };
}
