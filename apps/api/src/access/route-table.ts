import type { Express } from 'express';
import { declaredPermission } from './allow';
import type { Permission } from './policy';

/** One method on one path of the app, with the permission its allow() declares (if any). */
export interface RouteEntry {
  method: string;
  path: string;
  permission: Permission | undefined;
}

// The parts of Express 5's router (the `router` package) the walk reads. Not public API, so the
// shapes are spelled out here and the walk fails loudly in tests if they change.
interface RouteLike {
  path: string | RegExp | Array<string | RegExp>;
  methods: Record<string, boolean | undefined>;
  stack: Array<{ handle: unknown }>;
}
interface LayerLike {
  route?: RouteLike;
  handle: unknown;
  rawPath?: unknown;
}
interface RouterLike {
  stack: LayerLike[];
}

function isRouter(handle: unknown): handle is RouterLike {
  return typeof handle === 'function' && Array.isArray((handle as Partial<RouterLike>).stack);
}

const pathText = (path: unknown): string => {
  if (typeof path === 'string') return path === '/' ? '' : path;
  if (Array.isArray(path)) return path.map(pathText).join('|');
  return String(path);
};

function walk(router: RouterLike, prefix: string, out: RouteEntry[]): void {
  for (const layer of router.stack) {
    if (layer.route) {
      const permission = layer.route.stack.map((l) => declaredPermission(l.handle)).find((p) => p !== undefined);
      const path = prefix + (pathText(layer.route.path) || '/');
      for (const [method, on] of Object.entries(layer.route.methods)) {
        if (on) out.push({ method: method === '_all' ? 'ALL' : method.toUpperCase(), path, permission });
      }
    } else if (isRouter(layer.handle)) {
      walk(layer.handle, prefix + pathText(layer.rawPath ?? ''), out);
    }
  }
}

/** Every route of the app, nested routers included, in the order Express matches them. */
export function routeTable(app: Express): RouteEntry[] {
  const out: RouteEntry[] = [];
  walk(app.router as unknown as RouterLike, '', out);
  return out;
}
