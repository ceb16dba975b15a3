/**
 * Every route an Express 5 app answers, read from its router stack: each layer keeps the path it was
 * mounted at (`rawPath`), routes keep theirs (`route.path`) and their methods, sub-routers their own
 * stack. Paths come back in Express syntax ("/api/benches/:benchId"), methods in lower case.
 * Used by the OpenAPI completeness test and the README's routes table check.
 */
import type { Express } from 'express';

export interface MountedRoute {
  method: string;
  path: string;
}

interface StackLayer {
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: StackLayer[] };
}

function join(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

function pathsOf(raw: unknown): string[] {
  if (typeof raw === 'string') return [raw];
  if (Array.isArray(raw)) return raw.filter((p): p is string => typeof p === 'string');
  return [];
}

function walk(stack: StackLayer[], prefix: string, out: MountedRoute[]): void {
  for (const layer of stack) {
    if (layer.route) {
      for (const path of pathsOf(layer.route.path)) {
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== '_all') out.push({ method: method.toLowerCase(), path: join(prefix, path) });
        }
      }
    } else if (layer.handle?.stack) {
      const mounts = pathsOf(layer.rawPath);
      for (const mount of mounts.length > 0 ? mounts : ['/']) walk(layer.handle.stack, join(prefix, mount), out);
    }
  }
}

/** The app's routes (deduplicated, sorted by path then method). */
export function mountedRoutes(app: Express): MountedRoute[] {
  const router = (app as unknown as { router: { stack: StackLayer[] } }).router;
  const out: MountedRoute[] = [];
  walk(router.stack, '', out);
  const seen = new Set<string>();
  return out
    .filter((r) => {
      const key = `${r.method} ${r.path}`;
      if (seen.has(key)) return false;
      seen.add(key);
      return true;
    })
    .sort((a, b) => a.path.localeCompare(b.path) || a.method.localeCompare(b.method));
}
