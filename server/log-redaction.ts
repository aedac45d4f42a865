import type { Request } from 'express';

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

/**
 * The route pattern that handled the request (`GET /api/tanks/:value/readings/:readingId`),
 * or null when no route did (a middleware or the API's catch-all answered). Express keeps
 * `req.route` relative to its router, so the mounted prefix comes from the URL, redacted.
 */
export function matchedRoute(req: Request): string | null {
  const pattern: unknown = req.route?.path;
  if (typeof pattern !== 'string') return null;
  const actual = (req.originalUrl.split('?')[0] ?? '').replace(/(.)\/+$/, '$1').split('/');
  const own = pattern === '/' ? 0 : pattern.replace(/\/+$/, '').split('/').length - 1;
  const prefix = redactUrl(actual.slice(0, actual.length - own).join('/'));
  return `${req.method} ${prefix}${pattern === '/' ? '' : pattern}`;
}
