import type { RequestHandler } from 'express';
import { CSRF_HEADER, CSRF_HEADER_VALUE } from '../../shared/api-error.js';
import { csrfRejected, unsupportedMediaType } from '../errors.js';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The only `/api` paths that take a file upload (multipart/form-data); the CSRF header is still required. */
export const MULTIPART_PATHS: readonly RegExp[] = [/^\/tanks\/[^/]+\/readings\/import\/(preview|commit)$/];

function hasBody(headers: Record<string, string | string[] | undefined>): boolean {
  const length = headers['content-length'];
  return headers['transfer-encoding'] !== undefined || (length !== undefined && length !== '0');
}

/**
 * Cross-site request forgery defences for every unsafe `/api` request (OWASP CSRF cheat sheet):
 * 1. Fetch metadata: a browser that says the request is cross-site is refused.
 * 2. Custom header: a form or "simple" cross-site fetch cannot set it; our app always does.
 * 3. JSON only: a body in any other type (text/plain, form, multipart) is refused with 415,
 *    because express.json() would silently ignore it.
 */
export const requestGuards: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  if (req.get('sec-fetch-site') === 'cross-site') return next(csrfRejected('Cross-site requests are not accepted.'));
  if (req.get(CSRF_HEADER) !== CSRF_HEADER_VALUE) return next(csrfRejected());
  if (hasBody(req.headers) && !req.is('application/json')) {
    const upload = req.is('multipart/form-data') && MULTIPART_PATHS.some((p) => p.test(req.path));
    if (!upload) return next(unsupportedMediaType());
  }
  next();
};

/** API answers are personal: never stored by browsers or proxies. */
export const noStore: RequestHandler = (_req, res, next) => {
  res.set('Cache-Control', 'no-store');
  next();
};
