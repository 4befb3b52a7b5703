// Every METHOD /path the Express app answers, found by walking its router stack (Express 5 keeps
// each layer's raw path), so the access matrix can fail when a route is added without a row.
import type { Express } from 'express';

interface Layer {
  rawPath?: string | string[];
  route?: { path: string; methods: Record<string, boolean>; stack: Layer[] };
  handle: { stack?: Layer[] } & ((...args: unknown[]) => unknown);
  name: string;
}

function join(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

function walk(stack: Layer[], prefix: string, out: Set<string>): void {
  for (const layer of stack) {
    if (layer.route) {
      for (const method of Object.keys(layer.route.methods)) {
        if (method === '_all') continue;
        out.add(`${method.toUpperCase()} ${join(prefix, layer.route.path)}`);
      }
    } else if (layer.handle?.stack) {
      const mount = Array.isArray(layer.rawPath) ? layer.rawPath[0] : (layer.rawPath ?? '/');
      walk(layer.handle.stack, join(prefix, typeof mount === 'string' ? mount : '/'), out);
    }
  }
}

export function listRoutes(app: Express): string[] {
  const out = new Set<string>();
  const router = (app as unknown as { router: { stack: Layer[] } }).router;
  walk(router.stack, '', out);
  return [...out].filter((r) => r.includes(' /api/')).sort();
}
