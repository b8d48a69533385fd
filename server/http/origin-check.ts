import type { RequestHandler } from "express";
import { forbidden } from "./http-error";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Refuses state-changing requests whose Origin (or, failing that, Referer) names another site.
 * Browsers always send Origin on cross-site POSTs; requests with neither header (curl, server-to-server) pass,
 * since they carry no ambient browser cookies from a foreign page.
 */
export function originCheck(exemptPaths: string[] = []): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method) || exemptPaths.includes(req.path)) return next();
    const source = req.headers.origin ?? req.headers.referer;
    if (!source) return next();
    let host: string;
    try {
      host = new URL(source).host;
    } catch {
      return next(forbidden("Request origin is not valid"));
    }
    if (host !== req.headers.host) return next(forbidden("Requests from another site are refused"));
    next();
  };
}
