import type { AppDeps } from "../../deps";
import { auditLog } from "../../db/schema";
import type { RequestContext } from "../../http/context";

export const AUDIT_KINDS = ["money", "plan", "user", "settings"] as const;
export type AuditKind = (typeof AUDIT_KINDS)[number];

export type AuditEntry = {
  kind: AuditKind;
  entity: string;
  entityId?: string | number | null;
  action: string;
  before?: unknown;
  after?: unknown;
};

/**
 * Appends one audit record. Call it inside the same transaction as the change (pass the tx as `db`)
 * so a change is never stored without its record. Only changed keys are kept for updates.
 */
export function recordAudit(db: Pick<AppDeps["db"], "insert">, ctx: RequestContext | null, entry: AuditEntry, at = Date.now()) {
  let { before, after } = entry;
  if (before && after && typeof before === "object" && typeof after === "object") {
    const b = before as Record<string, unknown>;
    const a = after as Record<string, unknown>;
    const keys = [...new Set([...Object.keys(b), ...Object.keys(a)])].filter((k) => JSON.stringify(b[k]) !== JSON.stringify(a[k]));
    before = Object.fromEntries(keys.map((k) => [k, b[k]]));
    after = Object.fromEntries(keys.map((k) => [k, a[k]]));
  }
  db.insert(auditLog)
    .values({
      at,
      userId: ctx?.actor.id ?? null,
      userName: ctx?.actor.name ?? null,
      address: ctx?.address ?? null,
      kind: entry.kind,
      entity: entry.entity,
      entityId: entry.entityId == null ? null : String(entry.entityId),
      action: entry.action,
      before: before ?? null,
      after: after ?? null,
    })
    .run();
}
