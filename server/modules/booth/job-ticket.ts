import { asc, eq } from "drizzle-orm";
import QRCode from "qrcode";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { jobItems } from "../../db/schema";
import { iso } from "../../http/dates";
import { getBooth } from "./booth.service";
import type { JobTicketDto } from "../../../shared/schemas/booth.schema";

/** The printable ticket: the job, its items and layers, and a QR code that opens the booth card. */
export async function jobTicket(deps: AppDeps, actor: Actor, jobId: number): Promise<JobTicketDto> {
  const booth = getBooth(deps, actor, jobId);
  const items = deps.db.select().from(jobItems).where(eq(jobItems.jobId, jobId)).orderBy(asc(jobItems.id)).all();
  const boothUrl = `${deps.publicUrl}/booth/${jobId}`;
  const qrDataUrl = await QRCode.toDataURL(boothUrl, { errorCorrectionLevel: "M", margin: 2, width: 320 });
  const { approvedPanel: _panel, ...job } = booth.job;
  return {
    job,
    items: items.map((i) => ({ name: i.name, substrate: i.substrate, surfaceArea: i.surfaceArea, areaUnit: i.areaUnit })),
    layers: booth.layers.map((l) => ({ position: l.position, kind: l.kind, name: l.name, coats: l.coats, flashMinutes: l.flashMinutes, dryMinutes: l.dryMinutes, cautions: l.cautions.filter((c) => c.id !== "defer").map((c) => c.title) })),
    boothUrl,
    qrDataUrl,
    printedAt: iso(deps.now()),
  };
}
