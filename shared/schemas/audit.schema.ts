import { z } from "zod";
import { pageQuerySchema } from "../api/pagination";
import { isoDateSchema } from "./common.schema";

export const AUDIT_KINDS = ["money", "plan", "user", "settings"] as const;
export type AuditKindName = (typeof AUDIT_KINDS)[number];

export const AUDIT_KIND_LABELS: Record<AuditKindName, string> = {
  money: "Money",
  plan: "Finish plans",
  user: "Users and roles",
  settings: "Settings",
};

export const listAuditQuerySchema = pageQuerySchema.extend({
  kind: z.enum(AUDIT_KINDS, { error: `kind must be one of: ${AUDIT_KINDS.join(", ")}` }).optional(),
  userId: z.string().max(64).optional(),
  /** Inclusive calendar dates (shop-local midnight to midnight). */
  from: isoDateSchema.optional(),
  to: isoDateSchema.optional(),
});
export type ListAuditQuery = z.infer<typeof listAuditQuerySchema>;

export type AuditEntryDto = {
  id: number;
  at: string;
  userId: string | null;
  userName: string | null;
  address: string | null;
  kind: string;
  entity: string;
  entityId: string | null;
  action: string;
  before: unknown;
  after: unknown;
};
