// Lists every API route the Express app answers, for the authorisation matrix and the fuzz
// tests: they fail when a route exists that they do not cover.
import type { Express } from 'express';

export interface RouteEntry {
  method: string;
  /** The full path pattern, e.g. `/api/collections/:collectionId/animals/:animalId`. */
  path: string;
}

interface Layer {
  rawPath?: unknown;
  handle: { stack?: Layer[] };
  route?: { path: string; methods: Record<string, boolean> };
}

function walk(stack: Layer[], prefix: string, out: RouteEntry[]) {
  for (const layer of stack) {
    if (layer.route) {
      for (const [method, on] of Object.entries(layer.route.methods)) {
        if (on && method !== '_all')
          out.push({ method: method.toUpperCase(), path: join(prefix, layer.route.path) });
      }
    } else if (layer.handle.stack) {
      const mount = typeof layer.rawPath === 'string' ? layer.rawPath : '';
      walk(layer.handle.stack, join(prefix, mount), out);
    }
  }
}

const join = (a: string, b: string) => `${a}/${b}`.replace(/\/+/g, '/').replace(/(.)\/$/, '$1');

export function listRoutes(app: Express): RouteEntry[] {
  const out: RouteEntry[] = [];
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '', out);
  return out.filter((r) => r.path.startsWith('/api/'));
}
