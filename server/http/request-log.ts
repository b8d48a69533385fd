import type { IncomingMessage, ServerResponse } from "node:http";
import { randomUUID } from "node:crypto";
import type { RequestHandler } from "express";
import { pinoHttp } from "pino-http";
import type { Logger } from "../log/logger";

/** An id a proxy in front of us already gave the request is kept if it is short and plain; anything else is replaced. */
const INCOMING_ID = /^[A-Za-z0-9._:-]{8,100}$/;

/** A path segment that looks like a token (a signed portal link, a reset key): long and made of token characters. */
const TOKENISH = /^[A-Za-z0-9._~%+=-]{24,}$/;

/**
 * The path as logged: no query string (tokens travel there) and every token-like segment masked. Ids and names
 * of routes stay readable, so a line still says which job or upload was asked for.
 */
export function loggablePath(url: string): string {
  const path = url.split(/[?#]/, 1)[0] ?? "";
  return path
    .split("/")
    .map((segment) => (TOKENISH.test(segment) ? "[redacted]" : segment))
    .join("/")
    .slice(0, 300);
}

type Req = IncomingMessage & { id?: unknown; originalUrl?: string; baseUrl?: string; route?: { path?: string } };
type Res = ServerResponse & { locals?: { route?: string } };

/** The route pattern that answered (`/api/jobs/:id`); the API guard notes it when the route matches. */
function routeOf(req: Req, res: Res): string | null {
  if (res.locals?.route) return res.locals.route;
  return req.route?.path ? `${req.baseUrl ?? ""}${req.route.path}` : null;
}

function line(req: Req, res: Res, durationMs: unknown) {
  return {
    method: req.method,
    route: routeOf(req, res),
    path: loggablePath(req.originalUrl ?? req.url ?? ""),
    status: res.headersSent ? res.statusCode : null,
    durationMs,
  };
}

/**
 * One JSON line per request (method, route, path without query, status, duration and request id), at `error`
 * for 5xx with the error attached. The id comes back as `X-Request-Id` on every response, static files included,
 * and in every error body (see errorBodiesCarryRequestId), so a user can quote it. Headers and bodies are never
 * logged: cookies, passwords, tokens and portal link signatures travel only there or in the query string.
 */
export function requestLog(logger: Logger): RequestHandler {
  return pinoHttp({
    logger,
    quietReqLogger: true,
    quietResLogger: true,
    customAttributeKeys: { reqId: "requestId", responseTime: "durationMs" },
    genReqId: (req, res) => {
      const incoming = req.headers["x-request-id"];
      const id = typeof incoming === "string" && INCOMING_ID.test(incoming) ? incoming : randomUUID();
      res.setHeader("X-Request-Id", id);
      return id;
    },
    customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? "error" : "info"),
    customSuccessObject: (req, res, val: Record<string, unknown>) => line(req, res, val.durationMs),
    customErrorObject: (req, res, err, val: Record<string, unknown>) => ({ ...line(req, res, val.durationMs), err }),
    customSuccessMessage: (req: Req, res) => `${req.method} ${routeOf(req, res) ?? loggablePath(req.originalUrl ?? "")} ${res.writableEnded ? res.statusCode : "aborted"}`,
    customErrorMessage: (req: Req, res) => `${req.method} ${routeOf(req, res) ?? loggablePath(req.originalUrl ?? "")} ${res.statusCode}`,
  }) as unknown as RequestHandler;
}

/** Adds the request id to every JSON error body (`{ error: { code, message, requestId } }`), whoever wrote it. */
export const errorBodiesCarryRequestId: RequestHandler = (req, res, next) => {
  const json = res.json.bind(res);
  res.json = (body?: unknown) => {
    const error = (body as { error?: unknown } | null)?.error;
    if (res.statusCode >= 400 && error && typeof error === "object" && !Array.isArray(error)) {
      return json({ ...(body as object), error: { ...error, requestId: String(req.id) } });
    }
    return json(body);
  };
  next();
};
