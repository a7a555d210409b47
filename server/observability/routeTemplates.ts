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

interface CompiledRoute extends RouteEntry {
  pattern: RegExp;
}

function compile(entry: RouteEntry): CompiledRoute {
  const source = entry.path
    .split('/')
    .map((segment) => (segment.startsWith(':') ? '[^/]+' : segment.startsWith('{*') ? '.*' : segment.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')))
    .join('/');
  return { ...entry, pattern: new RegExp(`^${source}/?$`) };
}

/**
 * Names a request by its route template (`GET /api/jobs/:jobId`), never by its
 * ids, so a metric has one series per route. Built on first use, after every
 * route is registered; a path no route answers is "unmatched".
 */
export function routeLabeller(app: Express): (method: string, path: string) => string {
  let routes: CompiledRoute[] | null = null;
  return (method, path) => {
    routes ??= routeTable(app).map(compile);
    const hit = routes.find((r) => r.method === method && r.pattern.test(path)) ?? (method === 'HEAD' ? routes.find((r) => r.method === 'GET' && r.pattern.test(path)) : undefined);
    // The web build's catch-all answers every other path; an unknown /api path is not a route of it.
    if (!hit || (hit.path.startsWith('/{*') && path.startsWith('/api'))) return 'unmatched';
    return hit.path;
  };
}
