import type { Actor } from "../../auth/session";
import type { RequestContext } from "../../http/context";
import { HttpError } from "../../http/http-error";
import { recordAudit } from "../audit/audit.service";
import type { Db } from "./change-order-rows";
import { CHANGE_WAITING } from "../../../shared/domain/change-orders";

/**
 * The booth's rule for a layer a change order would alter while the customer has not approved it: no coat, unless the
 * owner gives a reason (kept on the coat and in the audit log). Returns the reason to record, or null when the layer
 * is not held. The refusal is a 409 naming the rule, like the timing rules.
 */
export function changeHoldOverride(actor: Actor, layer: { name: string; changeWaiting: boolean } | undefined, reason: string | null | undefined): string | null {
  if (!layer?.changeWaiting) return null;
  const rule = { rules: ["change_waiting"] };
  if (actor.role !== "owner")
    throw new HttpError(409, "conflict", `Not logged: ${CHANGE_WAITING}. ${layer.name} waits until the customer approves the change; only the owner can go ahead with a reason.`, { changeOverrideReason: "Only the owner can override a change waiting for the customer" }, rule);
  if (!reason)
    throw new HttpError(409, "conflict", `Not logged: ${CHANGE_WAITING}. ${layer.name} waits until the customer approves the change, or give a reason to go ahead (it is kept on the record).`, { changeOverrideReason: "Give a reason to spray before the customer approves the change" }, rule);
  return reason;
}

export function recordChangeOverride(tx: Db, ctx: RequestContext, what: { jobId: number; layerId: number; coatNumber: number; reason: string; changeOrderIds: number[] }, now: number) {
  recordAudit(tx, ctx, { kind: "plan", entity: "job", entityId: what.jobId, action: "change_wait_overridden", after: what }, now);
}
