import type { Express } from "express";
import type { Role } from "@loopyard/core";

/** One route of the app, as Express holds it. */
export interface RouteEntry {
  method: string;
  /** Full path with its parameters, e.g. /api/workspaces/:slug/plants/:plantId. */
  path: string;
  /** The role its memberOf check demands, or null when it has none (routes outside a workspace). */
  role: Role | null;
}

interface LayerLike {
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean>; stack: { handle: unknown }[] };
  handle?: { stack?: LayerLike[]; requiredRole?: Role };
}

function join(prefix: string, path: unknown): string {
  const part = typeof path === "string" ? path : "";
  const joined = `${prefix}/${part}`.replace(/\/+/g, "/");
  return joined.length > 1 ? joined.replace(/\/$/, "") : joined;
}

function walk(stack: readonly LayerLike[], prefix: string, inherited: Role | null, out: RouteEntry[]): void {
  let role = inherited;
  for (const layer of stack) {
    if (layer.route) {
      const path = join(prefix, layer.route.path);
      const own = layer.route.stack.map((item) => (item.handle as { requiredRole?: Role }).requiredRole).find((r) => r !== undefined);
      const methods = Object.entries(layer.route.methods).filter(([, on]) => on).map(([method]) => method.toUpperCase());
      // app.all() turns on every method Node knows: one entry "ALL".
      for (const method of methods.length > 10 ? ["ALL"] : methods) out.push({ method, path, role: own ?? role });
    } else if (layer.handle?.stack) {
      walk(layer.handle.stack, join(prefix, layer.rawPath), role, out);
    } else if (layer.handle?.requiredRole) {
      role = layer.handle.requiredRole;
    }
  }
}

/**
 * Every route of the app, walked from Express's router stack (mounted routers included), so that a
 * test over "every route" covers a route the day it is added. Middleware without a route (guards,
 * static files) is not listed.
 */
export function routeTable(app: Express): RouteEntry[] {
  const router = (app as unknown as { router?: { stack: LayerLike[] } }).router;
  if (!router) throw new Error("routeTable needs an Express 5 app with its router built");
  const out: RouteEntry[] = [];
  walk(router.stack, "", null, out);
  return out;
}
