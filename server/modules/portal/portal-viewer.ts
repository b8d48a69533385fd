import type { RequestHandler, Response } from "express";
import { eq } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { customers, jobs, quotes } from "../../db/schema";
import { forbidden, HttpError, unauthenticated } from "../../http/http-error";
import { verifyQuoteLink } from "./portal-link";

/**
 * Who is using the customer portal: a signed-in customer (all of their own quotes and jobs), or a visitor with a
 * signed quote link from an e-mail (that one quote and its job, until the link expires). Staff have no portal.
 */
export type PortalViewer =
  | { via: "account"; customerId: number; userId: string; name: string; token: null; quoteId: null; jobId: null; expiresAt: null }
  | { via: "link"; customerId: number; userId: null; name: string; token: string; quoteId: number; jobId: number; expiresAt: number };

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace -- Express declares res.locals in a global namespace; merging into it is the only way
  namespace Express {
    interface Locals {
      viewer?: PortalViewer;
    }
  }
}

const LINK_HEADER = "x-portal-token";

/** The viewer from a quote-link token, else from the signed-in account: 401 without either, 403 for staff. */
export function findViewer(deps: AppDeps, token: string | undefined, actor: Actor | undefined): PortalViewer {
  if (token) {
    const claims = verifyQuoteLink(deps.appSecret, token, deps.now());
    if (!claims) throw new HttpError(401, "unauthenticated", "This link has expired or is not valid. Ask the shop to send the quote again, or sign in to your account.");
    const row = deps.db
      .select({ jobId: jobs.id, customerId: jobs.customerId, name: customers.name })
      .from(quotes)
      .innerJoin(jobs, eq(quotes.jobId, jobs.id))
      .innerJoin(customers, eq(jobs.customerId, customers.id))
      .where(eq(quotes.id, claims.quoteId))
      .get();
    if (!row) throw new HttpError(401, "unauthenticated", "This quote is no longer available. Ask the shop for a new one.");
    return { via: "link", customerId: row.customerId, userId: null, name: row.name, token, quoteId: claims.quoteId, jobId: row.jobId, expiresAt: claims.expiresAt };
  }
  if (!actor) throw unauthenticated("Sign in, or open the link from the shop's e-mail");
  if (actor.role !== "customer") throw forbidden("The customer portal is for customers");
  return { via: "account", customerId: actor.customerId ?? -1, userId: actor.id, name: actor.name, token: null, quoteId: null, jobId: null, expiresAt: null };
}

/**
 * Middleware for portal routes (public at the guard, since a link stands in for a session): reads the quote-link
 * token (the header, or the `token` query for plain links such as images) or the session into `res.locals.viewer`.
 */
export function portalViewer(deps: AppDeps): RequestHandler {
  return (req, res, next) => {
    const fromQuery = typeof req.query.token === "string" ? req.query.token : undefined;
    res.locals.viewer = findViewer(deps, req.get(LINK_HEADER) ?? fromQuery, res.locals.actor);
    next();
  };
}

/** The viewer portalViewer() found for this request. */
export function viewerOf(res: Response): PortalViewer {
  const viewer = res.locals.viewer;
  if (!viewer) throw new Error("viewerOf() on a route without the portalViewer() middleware");
  return viewer;
}
