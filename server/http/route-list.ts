import type { Express } from 'express';

export interface RouteEntry {
  readonly method: string;
  readonly path: string;
}

interface StackLayer {
  rawPath?: unknown;
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: StackLayer[] };
}

/** Every route the app answers, read from Express 5's router stack (mounted routers included). */
export function listRoutes(app: Express): RouteEntry[] {
  const routes: RouteEntry[] = [];
  const walk = (stack: StackLayer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) {
          if (method === '_all') continue;
          routes.push({ method: method.toUpperCase(), path: join(prefix, layer.route.path) });
        }
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? join(prefix, layer.rawPath) : prefix);
      }
    }
  };
  walk((app as unknown as { router: { stack: StackLayer[] } }).router.stack, '');
  return routes;
}

function join(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}
