import type { Router } from "express";
import type { Guard } from "./guard";

export type RouteInfo = { method: string; path: string; access: Guard["access"] | null };

/**
 * Lists every route of the mounted API routers with the access its guard allows, read from the routers
 * themselves, so tests can check that no route is missing from the role matrix or has no guard.
 */
export function listRoutes(base: string, mounts: [string, Router][]): RouteInfo[] {
  const out: RouteInfo[] = [];
  for (const [prefix, router] of mounts) {
    for (const layer of router.stack as { route?: { path: string; methods: Record<string, boolean>; stack: { handle: unknown }[] } }[]) {
      if (!layer.route) continue;
      const guard = layer.route.stack.map((s) => s.handle as Partial<Guard>).find((h) => typeof h?.access === "string");
      for (const method of Object.keys(layer.route.methods)) {
        const path = `${base}${prefix}${layer.route.path === "/" ? "" : layer.route.path}`;
        out.push({ method: method.toUpperCase(), path, access: guard?.access ?? null });
      }
    }
  }
  return out;
}
