import type { Express } from 'express';

interface LayerLike {
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
}

/**
 * Every 'METHOD /api/path' registered in the app, found by walking Express's router stack
 * (so a route cannot hide from the role matrix by being registered some other way).
 */
export function listApiRoutes(app: Express): string[] {
  const root = (app as unknown as { router: { stack: LayerLike[] } }).router.stack;
  const api = root.find((l) => l.rawPath === '/api' && l.handle?.stack);
  if (!api) throw new Error('no /api router mounted');
  const out: string[] = [];
  const walk = (stack: LayerLike[], prefix: string): void => {
    for (const layer of stack) {
      if (layer.route) {
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== '_all')
            out.push(`${method.toUpperCase()} ${prefix}${String(layer.route.path)}`);
        }
      } else if (layer.handle?.stack) {
        const sub = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
        walk(layer.handle.stack, prefix + sub);
      }
    }
  };
  walk(api.handle!.stack!, '/api');
  return out;
}
