import type { Request, Response } from "express";
import { actorOf } from "./guard";
import type { Actor } from "../auth/session";

/** Who is asking and from where: what services need to scope data and write the audit trail. */
export type RequestContext = { actor: Actor; address: string | null };

export function ctxOf(req: Request, res: Response): RequestContext {
  return { actor: actorOf(res), address: req.ip ?? null };
}
