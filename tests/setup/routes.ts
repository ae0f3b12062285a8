import type { Server } from "node:http";

export type RouteInfo = { method: string; path: string };

type Layer = { route?: { path: string | string[]; methods: Record<string, boolean> }; handle?: { stack?: Layer[] }; rawPath?: string | string[] };

/**
 * Every route the Express app answers, read from its router stack (Express 5 / router 2), so a
 * test that walks them also covers routes added later. Paths are full, e.g. "/api/strips/:id".
 */
export function listRoutes(server: Server): RouteInfo[] {
  const app = server.listeners("request")[0] as unknown as { router: { stack: Layer[] } };
  const out: RouteInfo[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const p of [layer.route.path].flat()) {
          for (const m of Object.keys(layer.route.methods)) {
            if (m === "_all") continue;
            out.push({ method: m.toUpperCase(), path: prefix + p });
          }
        }
      } else if (layer.handle?.stack) {
        const raw = [layer.rawPath ?? "/"].flat()[0]!;
        walk(layer.handle.stack, raw === "/" ? prefix : prefix + raw);
      }
    }
  };
  walk(app.router.stack, "");
  // The same route can be registered in two routers (e.g. GET /api/strips/:id/...): keep one.
  return [...new Map(out.map((r) => [`${r.method} ${r.path}`, r])).values()];
}

/** A path with its parameters filled in (numbers for ids, a uuid where a member id is taken). */
export function fillPath(path: string, value: (name: string) => string): string {
  return path.replace(/:(\w+)/g, (_m, name: string) => encodeURIComponent(value(name))).replace(/\{?\/?\*\w+\}?/g, "/x");
}
