import type { Express } from 'express';

/** One route the app answers, e.g. { method: 'DELETE', path: '/api/customers/:id' }. */
export interface RouteEntry {
  method: string;
  path: string;
}

interface Layer {
  rawPath?: string | string[];
  slash?: boolean;
  route?: { path: string; methods: Record<string, boolean> };
  handle: { stack?: Layer[] };
}

const join = (prefix: string, path: string) => `${prefix}${path === '/' ? '' : path}`.replace(/\/+/g, '/') || '/';

function walk(stack: Layer[], prefix: string, out: RouteEntry[]) {
  for (const layer of stack) {
    if (layer.route) {
      for (const [method, on] of Object.entries(layer.route.methods)) {
        if (on && method !== '_all') out.push({ method: method.toUpperCase(), path: join(prefix, layer.route.path) });
      }
    } else if (layer.handle.stack) {
      const mount = layer.slash || typeof layer.rawPath !== 'string' ? '' : layer.rawPath;
      walk(layer.handle.stack, join(prefix, mount), out);
    }
  }
}

/**
 * Every method and path registered on the app, read from Express's own router
 * stack (routes and mounted routers, however deeply nested), so a route added
 * anywhere shows up here without anyone listing it.
 */
export function routeTable(app: Express): RouteEntry[] {
  const router = (app as unknown as { router: { stack: Layer[] } }).router;
  const out: RouteEntry[] = [];
  walk(router.stack, '', out);
  return out;
}
