import type { Request, RequestHandler } from "express";
import { HttpError } from "./http-error";

const STATE_CHANGING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/** Marks a route's file-receiving middleware: only such routes take multipart/form-data. */
export function acceptsFiles<T extends RequestHandler>(handler: T): T & { acceptsFiles: true } {
  return Object.assign(handler, { acceptsFiles: true as const });
}

const mediaTypeOf = (req: Request) => (req.headers["content-type"] ?? "").split(";")[0]!.trim().toLowerCase();

/**
 * A state-changing request that carries a body (or names a type) must send JSON, or multipart/form-data to a route
 * that takes a file: anything else is 415, before the route does anything. A form or a `text/plain` request from
 * another page (which a browser sends without asking) then never reaches a refund or an approval. A request with no
 * body and no type (a bare POST to sign out) passes. Called by the route guard, which knows the route.
 */
export function mediaTypeError(req: Request): HttpError | null {
  if (!STATE_CHANGING.has(req.method)) return null;
  const type = mediaTypeOf(req);
  const length = Number(req.headers["content-length"] ?? 0);
  const hasBody = type !== "" || length > 0 || req.headers["transfer-encoding"] !== undefined;
  if (!hasBody || type === "application/json") return null;
  const takesFiles = (req.route as { stack?: { handle: Partial<{ acceptsFiles: true }> }[] } | undefined)?.stack?.some((l) => l.handle.acceptsFiles) ?? false;
  if (takesFiles && type === "multipart/form-data") return null;
  const want = takesFiles ? "multipart/form-data (a file) or application/json" : "application/json";
  return new HttpError(415, "unsupported_media_type", `Send this request as ${want}${type ? `, not ${type}` : " with a Content-Type header"}`);
}
