// Every route of an Express app, found by walking its router: the permissions test and the contracts test
// both check their tables against this list, so a new route fails them until it is added.
import type { Express } from 'express';

export interface ListedRoute {
  key: string;
  /** The permissions the route's handlers carry (`scoped` tags the handler it builds). */
  tags: string[];
}

interface LayerLike {
  rawPath?: unknown;
  handle?: { stack?: LayerLike[]; permission?: unknown };
  route?: { path: unknown; methods: Record<string, boolean>; stack: { handle: { permission?: unknown } }[] };
}

function joinPath(prefix: string, part: string): string {
  const joined = `${prefix}/${part}`.replace(/\/{2,}/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

/** Every route of the app, walking nested routers with the paths they are mounted at. */
export function listRoutes(app: Express): ListedRoute[] {
  const found: ListedRoute[] = [];
  const walk = (stack: LayerLike[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        // A route path that is not a plain string (a RegExp or a list) cannot be named in the table.
        if (typeof layer.route.path !== 'string') throw new Error(`a route under ${prefix} has a path that is not a string`);
        const tags = layer.route.stack.map((s) => s.handle.permission).filter((p): p is string => typeof p === 'string');
        for (const method of Object.keys(layer.route.methods)) {
          found.push({ key: `${method === '_all' ? 'ALL' : method.toUpperCase()} ${joinPath(prefix, layer.route.path)}`, tags });
        }
      } else if (Array.isArray(layer.handle?.stack)) {
        // Express 5's router keeps the path a router was mounted at as `rawPath`; without it the names
        // below would be wrong, so stop instead of guessing.
        if (typeof layer.rawPath !== 'string') throw new Error(`cannot tell where a router under "${prefix || '/'}" is mounted`);
        walk(layer.handle.stack, joinPath(prefix, layer.rawPath));
      }
    }
  };
  walk((app as unknown as { router: { stack: LayerLike[] } }).router.stack, '');
  return found;
}
