import { and, asc, desc, eq } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { panelSignOffs } from "../../db/schema";
import { iso, isoOrNull } from "../../http/dates";
import type { PanelSignOffDto } from "../../../shared/schemas/colour-sign-off.schema";

type SignOffRow = typeof panelSignOffs.$inferSelect;

/** A sign-off as the shop or the customer reads it; photo addresses depend on who reads (staff files or portal photos). */
export function toSignOffDto(row: SignOffRow, photo: (id: number, thumb: boolean) => string, forShop: boolean): PanelSignOffDto {
  return {
    id: row.id,
    jobId: row.jobId,
    panelId: row.panelId,
    status: row.status,
    label: row.label,
    letDownClear: row.letDownClear,
    letDownToner: row.letDownToner,
    coats: row.coats,
    targetLabel: row.targetLabel,
    deltaE: row.deltaE,
    photo: row.photoId != null ? { url: photo(row.photoId, false), thumbUrl: photo(row.photoId, true) } : null,
    message: row.message,
    sentAt: iso(row.sentAt),
    decidedAt: isoOrNull(row.decidedAt),
    decisionName: row.decisionName,
    decidedVia: row.decidedVia,
    decidedAddress: forShop ? row.decidedAddress : null,
  };
}

export const staffPhotoUrl = (id: number, thumb: boolean) => `/api/uploads/${id}${thumb ? "/thumb" : ""}`;

/** Every panel sent to the customer for a job, newest first. */
export function signOffsOf(deps: Pick<AppDeps, "db">, jobId: number): SignOffRow[] {
  return deps.db.select().from(panelSignOffs).where(eq(panelSignOffs.jobId, jobId)).orderBy(desc(panelSignOffs.sentAt), asc(panelSignOffs.id)).all();
}

/** True when the job's agreed colour is a panel the customer approved in the portal. */
export function customerApprovedColour(deps: Pick<AppDeps, "db">, job: { id: number; approvedPanelId: number | null }): boolean {
  if (job.approvedPanelId == null) return false;
  return !!deps.db
    .select({ id: panelSignOffs.id })
    .from(panelSignOffs)
    .where(and(eq(panelSignOffs.jobId, job.id), eq(panelSignOffs.panelId, job.approvedPanelId), eq(panelSignOffs.status, "approved")))
    .get();
}
