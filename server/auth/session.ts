import type { Request, RequestHandler, Response } from "express";
import type { Cookie } from "lucia";
import type { AppLucia } from "./lucia";
import type { SessionUser } from "../../shared/schemas/auth.schema";

export type Actor = SessionUser;

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace -- Express declares res.locals in a global namespace; merging into it is the only way
  namespace Express {
    interface Locals {
      actor?: Actor;
      sessionId?: string;
    }
  }
}

/** Writes a Lucia cookie; Secure is set when the request came over https. */
export function writeCookie(req: Request, res: Response, cookie: Cookie) {
  res.cookie(cookie.name, cookie.value, {
    httpOnly: true,
    sameSite: "lax",
    secure: req.secure,
    path: "/",
    ...(cookie.attributes.maxAge !== undefined ? { maxAge: cookie.attributes.maxAge * 1000 } : {}),
  });
}

/** Reads the session cookie, validates it, refreshes it when Lucia says so, and puts the user on res.locals.actor. */
export function sessionMiddleware(lucia: AppLucia): RequestHandler {
  return async (req, res, next) => {
    const sessionId = lucia.readSessionCookie(req.headers.cookie ?? "");
    if (!sessionId) return next();
    const { session, user } = await lucia.validateSession(sessionId);
    if (!session || !user || !user.active) {
      if (session) await lucia.invalidateSession(session.id);
      writeCookie(req, res, lucia.createBlankSessionCookie());
      return next();
    }
    if (session.fresh) writeCookie(req, res, lucia.createSessionCookie(session.id));
    res.locals.sessionId = session.id;
    res.locals.actor = { id: user.id, email: user.email, name: user.name, role: user.role, customerId: user.customerId };
    next();
  };
}
