import type { Express } from 'express';

export type RouteEntry = { method: string; path: string };

type Layer = {
  name?: string;
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
};

// Express 5's router keeps the path a layer was mounted with in `rawPath`; a router mounted without a
// path (our feature routers) has none. Only string paths are used in Kitlane, so arrays/regexps are refused
// loudly rather than guessed.
function mountPathOf(layer: Layer): string {
  if (layer.rawPath === undefined || layer.rawPath === null || layer.rawPath === '/') return '';
  if (typeof layer.rawPath !== 'string') throw new Error(`route table: unsupported mount path ${String(layer.rawPath)}`);
  return layer.rawPath;
}

function walk(stack: Layer[], prefix: string, out: RouteEntry[]): void {
  for (const layer of stack) {
    if (layer.route) {
      if (typeof layer.route.path !== 'string') throw new Error(`route table: unsupported route path under ${prefix}`);
      for (const [method, on] of Object.entries(layer.route.methods)) {
        if (on && method !== '_all') out.push({ method: method.toUpperCase(), path: prefix + layer.route.path });
      }
    } else if (layer.handle?.stack) {
      walk(layer.handle.stack, prefix + mountPathOf(layer), out);
    }
  }
}

/** Every API route of the running app (method + path with :params), read from Express's own route table. */
export function apiRoutes(app: Express): RouteEntry[] {
  const root = (app as unknown as { router: { stack: Layer[] } }).router;
  const out: RouteEntry[] = [];
  walk(root.stack, '', out);
  const seen = new Set<string>();
  return out
    .filter((r) => r.path.startsWith('/api/'))
    .filter((r) => {
      const key = `${r.method} ${r.path}`;
      if (seen.has(key)) return false;
      seen.add(key);
      return true;
    });
}

export const routeKey = (r: RouteEntry) => `${r.method} ${r.path}`;
