import type { Express } from 'express';

/** One route Express would answer, as found by walking the app's router stack. */
export interface MountedRoute {
  method: string;
  path: string;
}

interface Layer {
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
  rawPath?: string | string[] | RegExp;
  name?: string;
}

function join(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

function walk(stack: Layer[], prefix: string, found: MountedRoute[]): void {
  for (const layer of stack) {
    if (layer.route) {
      for (const path of ([] as string[]).concat(layer.route.path)) {
        for (const method of Object.keys(layer.route.methods)) if (method !== '_all') found.push({ method, path: join(prefix, path) });
      }
    } else if (layer.handle?.stack) {
      // A mounted router (router 2.x keeps the mount path as rawPath).
      const mount = typeof layer.rawPath === 'string' ? layer.rawPath : '';
      walk(layer.handle.stack, join(prefix, mount), found);
    }
  }
}

/**
 * Every method + path the app's routers define, however they were mounted — so a route
 * added with a plain Router, bypassing the route table, is found too.
 */
export function mountedRoutes(app: Express): MountedRoute[] {
  const router = (app as unknown as { router: { stack: Layer[] } }).router;
  const found: MountedRoute[] = [];
  walk(router.stack, '', found);
  return found;
}
