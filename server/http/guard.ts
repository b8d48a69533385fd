import type { RequestHandler, Response } from "express";
import { ACCESS, type Access } from "../../shared/domain/roles";
import { forbidden, unauthenticated } from "./http-error";
import { mediaTypeError } from "./media-type";
import type { Actor } from "../auth/session";

/** A guard middleware remembers what it allows, so tests can read every route's rule from the router. */
export type Guard = RequestHandler & { access: Access | "public" };

/**
 * The one permission guard. Every API route is declared with exactly one of these:
 * `allow("office")`, `allow("staff")`, … or `allow("public")`. 401 when signed out, 403 for a role outside the group,
 * then 415 for a state-changing request whose body is not JSON (see media-type.ts).
 */
export function allow(access: Access | "public"): Guard {
  const handler: RequestHandler = (req, res, next) => {
    // The route pattern for the request's log line, noted here because every API route starts with its guard.
    res.locals.route ??= req.route?.path === "/" ? req.baseUrl : `${req.baseUrl}${req.route?.path ?? ""}`;
    if (access !== "public") {
      const actor = res.locals.actor;
      if (!actor) return next(unauthenticated());
      if (!(ACCESS[access] as readonly string[]).includes(actor.role)) return next(forbidden());
    }
    next(mediaTypeError(req) ?? undefined);
  };
  return Object.assign(handler, { access });
}

/** The signed-in actor; only call behind a non-public guard. */
export function actorOf(res: Response): Actor {
  const actor = res.locals.actor;
  if (!actor) throw unauthenticated();
  return actor;
}
