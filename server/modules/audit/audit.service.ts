import { and, count, desc, eq, gte, like, lt, or, type SQL } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Page } from "../../../shared/api/pagination";
import type { AuditEntryDto, ListAuditQuery } from "../../../shared/schemas/audit.schema";
import { auditLog } from "../../db/schema";
import type { RequestContext } from "../../http/context";

import type { AuditKindName } from "../../../shared/schemas/audit.schema";

export type AuditKind = AuditKindName;

export type AuditEntry = {
  kind: AuditKind;
  entity: string;
  entityId?: string | number | null;
  action: string;
  before?: unknown;
  after?: unknown;
  /** Keys kept on both sides even when unchanged, to name the record in words (a material's code and name). */
  keep?: readonly string[];
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
    const keys = [...new Set([...Object.keys(b), ...Object.keys(a)])].filter((k) => entry.keep?.includes(k) || JSON.stringify(b[k]) !== JSON.stringify(a[k]));
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

/** Local calendar date → epoch ms at local midnight. */
function dayStart(date: string) {
  const [y, m, d] = date.split("-").map(Number) as [number, number, number];
  return new Date(y, m - 1, d).getTime();
}

export function listAudit(deps: AppDeps, q: ListAuditQuery): Page<AuditEntryDto> {
  const filters: SQL[] = [];
  if (q.kind) filters.push(eq(auditLog.kind, q.kind));
  if (q.userId) filters.push(eq(auditLog.userId, q.userId));
  if (q.from) filters.push(gte(auditLog.at, dayStart(q.from)));
  if (q.to) filters.push(lt(auditLog.at, dayStart(q.to) + 86_400_000));
  if (q.q) filters.push(or(like(auditLog.entity, `%${q.q}%`), like(auditLog.action, `%${q.q}%`), like(auditLog.userName, `%${q.q}%`), eq(auditLog.entityId, q.q))!);
  const where = filters.length ? and(...filters) : undefined;
  const rows = deps.db
    .select()
    .from(auditLog)
    .where(where)
    .orderBy(desc(auditLog.at), desc(auditLog.id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize)
    .all();
  const total = deps.db.select({ n: count() }).from(auditLog).where(where).get()?.n ?? 0;
  return { items: rows.map((r) => ({ ...r, at: new Date(r.at).toISOString() })), total, page: q.page, pageSize: q.pageSize };
}
