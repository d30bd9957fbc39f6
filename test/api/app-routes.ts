import type { Express } from 'express';

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
  rawPath?: unknown;
  handle: { stack?: Layer[] };
}

/**
 * Every `METHOD /path` the Express app serves under /api, found by walking its routers (Express
 * 5's `app.router.stack`), so a route added anywhere is found without being listed by hand.
 */
export function appRoutes(app: Express): string[] {
  const found = new Set<string>();
  const stack = (app as unknown as { router: { stack: Layer[] } }).router.stack;
  for (const layer of stack) {
    const mount = typeof layer.rawPath === 'string' ? layer.rawPath : '';
    if (!mount.startsWith('/api') || !layer.handle.stack) continue;
    for (const inner of layer.handle.stack) {
      if (!inner.route) continue;
      for (const method of Object.keys(inner.route.methods)) {
        const path = `${mount}${inner.route.path === '/' ? '' : inner.route.path}`.replace(/^\/api\/\//, '/api/');
        found.add(`${method.toUpperCase()} ${path}`);
      }
    }
  }
  return [...found].sort();
}
