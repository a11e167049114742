// Every route a running app has mounted, read from Express's own router (nested routers
// included), so tests that go over all routes cover a new route without being edited.
import type { Express } from 'express';
import type { ZodType } from 'zod';

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface MountedRoute {
  method: HttpMethod;
  /** The full path as mounted, e.g. /api/blocks/:id/bloom-windows. */
  path: string;
  /** Path parameter names in order, e.g. ['id']. */
  params: string[];
  /** The zod schemas the route's validate() middleware parses with, when it has one. */
  schemas: { body?: ZodType; query?: ZodType; params?: ZodType };
  /** The route takes a multipart upload (singleFileUpload or a bare multer middleware in its stack). */
  upload: boolean;
}

interface Layer {
  rawPath?: string | string[];
  handle: ((...args: unknown[]) => unknown) & { stack?: Layer[]; schemas?: MountedRoute['schemas']; uploadField?: string };
  name?: string;
  route?: { path: string | string[]; methods: Record<string, boolean>; stack: Layer[] };
}

const join = (prefix: string, path: string) => `${prefix}/${path}`.replace(/\/+/g, '/').replace(/(.)\/$/, '$1');

function walk(stack: Layer[], prefix: string, out: MountedRoute[]) {
  for (const layer of stack) {
    if (layer.route) {
      const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
      for (const routePath of paths) {
        const path = join(prefix, routePath);
        const handlers = layer.route.stack.map((l) => l.handle);
        const schemas = handlers.find((h) => h.schemas)?.schemas ?? {};
        const upload = handlers.some((h) => h.uploadField !== undefined || h.name === 'multerMiddleware');
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (!on || method === '_all') continue;
          out.push({ method: method.toUpperCase() as HttpMethod, path, params: [...path.matchAll(/:(\w+)/g)].map((m) => m[1]), schemas, upload });
        }
      }
    } else if (Array.isArray(layer.handle.stack)) {
      const mount = typeof layer.rawPath === 'string' ? layer.rawPath : '/';
      walk(layer.handle.stack, join(prefix, mount), out);
    }
  }
}

/** The API routes of an app (under /api), each method of a path on its own. */
export function mountedRoutes(app: Express): MountedRoute[] {
  const router = (app as unknown as { router: { stack: Layer[] } }).router;
  const out: MountedRoute[] = [];
  walk(router.stack, '', out);
  return out.filter((r) => r.path.startsWith('/api/') && r.method !== ('HEAD' as HttpMethod));
}

/** A route's path with its parameters filled in (a missing value keeps the placeholder's name). */
export function fillPath(route: Pick<MountedRoute, 'path'>, values: Record<string, string>): string {
  return route.path.replace(/:(\w+)/g, (_, name: string) => encodeURIComponent(values[name] ?? name));
}
