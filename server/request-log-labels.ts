import type { Request, RequestHandler, Response } from 'express';

/** Path segments that are followed by a secret token (share, invite and unsubscribe links). */
const TOKEN_PARENTS = new Set(['s', 'share', 'invite', 'invites', 'unsubscribe']);

/**
 * A URL fit for a log line: every query value hidden (reset links carry `?token=`), the
 * segment after a token-bearing parent hidden, and any long (id- or token-like) segment
 * hidden. Logs then show the shape of a request, never a token that would open it.
 */
export function redactUrl(url: string): string {
  const q = url.indexOf('?');
  const path = q === -1 ? url : url.slice(0, q);
  const query = q === -1 ? '' : url.slice(q + 1);
  const segments = path.split('/');
  const safePath = segments.map((seg, i) => (seg.length >= 20 || (seg && i > 0 && TOKEN_PARENTS.has(segments[i - 1]!)) ? ':value' : seg)).join('/');
  const safeQuery = query ? `?${query.split('&').map((kv) => `${kv.split('=')[0]}=:value`).join('&')}` : '';
  return safePath + safeQuery;
}

/** res.locals marks: a mount's own guards ran (see `guardedMount`), or the API's catch-all answered. */
const GUARDED = 'guardedMount';
const NO_ROUTE = 'noRoute';

/**
 * Put first in a `router.use(path, …guards, nestedRouter)` chain: the guards of that mount
 * (sign-in, owns the tank) are the nested routes' own, so their refusals count as the route's.
 */
export const guardedMount: RequestHandler = (_req, res, next) => {
  res.locals[GUARDED] = true;
  next();
};

/** The API's catch-all marks its 404 as answered by no route. */
export function markNoRoute(res: Response): void {
  res.locals[NO_ROUTE] = true;
}

/**
 * The route that answered (`GET /api/tanks/:value/readings/:readingId`), or null when none
 * did: a global layer (request guards, session, the API's catch-all) answered instead. Express
 * keeps `req.route` relative to its router, so the mounted prefix comes from the URL,
 * redacted; a guarded mount's refusal (before its routes are matched) is labelled by its URL.
 */
export function matchedRoute(req: Request, res: Response): string | null {
  if (res.locals[NO_ROUTE]) return null;
  const pattern: unknown = req.route?.path;
  if (typeof pattern !== 'string') return res.locals[GUARDED] ? `${req.method} ${redactUrl(req.originalUrl.split('?')[0] ?? '')}` : null;
  const actual = (req.originalUrl.split('?')[0] ?? '').replace(/(.)\/+$/, '$1').split('/');
  const own = pattern === '/' ? 0 : pattern.replace(/\/+$/, '').split('/').length - 1;
  const prefix = redactUrl(actual.slice(0, actual.length - own).join('/'));
  return `${req.method} ${prefix}${pattern === '/' ? '' : pattern}`;
}
