import type { Express } from 'express';

export interface RouteEntry {
  method: string;
  /** Full pattern as Express matches it, e.g. `/api/tanks/:tankId`. */
  path: string;
}

interface LayerLike {
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
}

const join = (a: string, b: string) => `${a}/${b}`.replace(/\/+/g, '/').replace(/(.)\/$/, '$1');

/**
 * Every (method, path) the app answers, found by walking Express 5's router stack (routers
 * mounted with `use(path, router)` keep their mount path in `layer.rawPath`). Middleware-only
 * layers (no route) are skipped; the static site's catch-all is a route and is listed.
 */
export function listRoutes(app: Express): RouteEntry[] {
  const out: RouteEntry[] = [];
  const walk = (stack: LayerLike[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
        for (const p of paths) {
          for (const [method, on] of Object.entries(layer.route.methods)) {
            if (on && method !== '_all') out.push({ method: method.toUpperCase(), path: join(prefix, String(p)) });
          }
        }
      } else if (layer.handle?.stack) {
        const mount = typeof layer.rawPath === 'string' ? layer.rawPath : '/';
        walk(layer.handle.stack, join(prefix, mount));
      }
    }
  };
  walk((app as unknown as { router: { stack: LayerLike[] } }).router.stack, '');
  return out.filter((r, i) => out.findIndex((o) => o.method === r.method && o.path === r.path) === i);
}
