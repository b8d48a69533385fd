import { and, asc, eq } from "drizzle-orm";
import { customers, inspectionItems, inspections, jobItems, jobs, panelSignOffs, testPanels, uploads } from "../schema";
import { panelLabel } from "../../modules/panels/panels.service";
import { addPhoto, swatchRgb } from "./booth";
import type { InspectedItem } from "../../../shared/domain/intake";
import type { SeedContext } from "./core";

/**
 * Demo intake and colour sign-off:
 *  - the demo customer's fibreglass hood scoop was inspected before it was quoted (pinholes, stress cracks, an old
 *    repair), with one photo shared with the customer and one kept in the shop; its quote carries the prep line;
 *  - another customer's truck hood was inspected too (surface rust);
 *  - the hood scoop's agreed colour is a panel the customer approved in the portal;
 *  - another customer has two panels waiting for an answer.
 */
const HOUR = 3_600_000;
const DAY = 24 * HOUR;

type Findings = Omit<InspectedItem, "name" | "area" | "areaUnit">;

function inspect(ctx: SeedContext, jobId: number, at: number, head: { customerSummary: string; notes: string }, items: (Findings & { measured?: [number, "m2" | "ft2"]; note?: string })[]) {
  const inspectionId = ctx.db
    .insert(inspections)
    .values({ jobId, ...head, inspectedBy: ctx.userIds.estimator, inspectedAt: at, createdAt: at, updatedAt: at, updatedBy: ctx.userIds.estimator })
    .returning({ id: inspections.id })
    .get().id;
  const jobItemRows = ctx.db.select().from(jobItems).where(eq(jobItems.jobId, jobId)).orderBy(asc(jobItems.id)).all();
  return items.map((it, i) => {
    const { measured, note, ...findings } = it;
    return ctx.db
      .insert(inspectionItems)
      .values({ inspectionId, jobId, itemId: jobItemRows[i]!.id, ...findings, measuredArea: measured?.[0] ?? null, areaUnit: measured?.[1] ?? null, note: note ?? null, createdAt: at, updatedAt: at, updatedBy: ctx.userIds.estimator })
      .returning({ id: inspectionItems.id })
      .get().id;
  });
}

const none = { dents: "none", cracks: "none", pinholes: "none", stressCracks: "none", rust: "none", earlierRepairs: "none" } as const;

export async function seedIntake(ctx: SeedContext) {
  const demoCustomer = ctx.customerIds[0]!;
  const scoop = ctx.jobs.find((j) => j.customerId === demoCustomer && j.title.startsWith("Hot-rod hood scoop"));
  if (scoop) {
    const at = scoop.createdAt + 3 * HOUR;
    const [itemId] = inspect(
      ctx,
      scoop.id,
      at,
      {
        customerSummary: "The scoop is sound. We found pinholes along the front lip and two small stress cracks at the mounting corners; we open, fill and seal those before any colour goes on.",
        notes: "Old filler under the front lip: let it gas out a day before sealing.",
      },
      [{ ...none, existingFinish: "old_custom_finish", pinholes: "minor", stressCracks: "minor", earlierRepairs: "minor", hardwareToRemove: "Two mounting studs", solventTest: "softens", measured: [4.5, "ft2"], note: "Shrink-back risk at the lip" }],
    );
    await addPhoto(ctx, { ownerType: "inspection_item", ownerId: itemId!, jobId: scoop.id }, { r: 196, g: 188, b: 170 }, `intake-${scoop.id}.jpg`, { caption: "Pinholes along the front lip", shareable: true, by: ctx.userIds.estimator, at });
    await addPhoto(ctx, { ownerType: "inspection_item", ownerId: itemId!, jobId: scoop.id }, { r: 150, g: 144, b: 132 }, `intake-${scoop.id}-lip.jpg`, { caption: "Old filler under the lip (shop only)", by: ctx.userIds.estimator, at: at + 60_000 });
    approvedInPortal(ctx, scoop.id);
  }
  const hood = ctx.jobs.find((j) => j.customerId !== demoCustomer && j.stage === "quoted" && j.title.startsWith("Truck hood"));
  const other = hood ?? ctx.jobs.find((j) => j.customerId !== demoCustomer && j.stage === "quoted")!;
  const otherAt = other.createdAt + 2 * HOUR;
  const [hoodItem] = inspect(ctx, other.id, otherAt, { customerSummary: "Surface rust along the leading edge; the rest is sound.", notes: "Check under the hinge plates." }, [
    { ...none, existingFinish: "factory_finish", rust: "minor", dents: "minor", hardwareToRemove: "Hood ornament and washer jets", solventTest: "unaffected", note: "Customer wants the ornament back polished" },
  ]);
  await addPhoto(ctx, { ownerType: "inspection_item", ownerId: hoodItem!, jobId: other.id }, { r: 140, g: 82, b: 52 }, `intake-${other.id}.jpg`, { caption: "Rust on the leading edge", shareable: true, by: ctx.userIds.estimator, at: otherAt });
  await waitingPanels(ctx);
}

/** The daylight photo of a panel (or its first). */
const panelPhoto = (ctx: SeedContext, panelId: number) =>
  ctx.db
    .select({ id: uploads.id, light: uploads.light })
    .from(uploads)
    .where(and(eq(uploads.ownerType, "panel"), eq(uploads.ownerId, panelId)))
    .orderBy(asc(uploads.id))
    .all()
    .sort((a, b) => Number(b.light === "daylight") - Number(a.light === "daylight"))[0]?.id ?? null;

function signOff(ctx: SeedContext, jobId: number, panel: typeof testPanels.$inferSelect, sentAt: number, to: string, decided?: { at: number; name: string }) {
  ctx.db
    .insert(panelSignOffs)
    .values({
      jobId,
      panelId: panel.id,
      status: decided ? "approved" : "waiting",
      label: panelLabel(panel),
      letDownClear: panel.letDownClear,
      letDownToner: panel.letDownToner,
      coats: panel.coats,
      photoId: panelPhoto(ctx, panel.id),
      sentTo: to,
      sentBy: ctx.userIds.estimator,
      sentAt,
      decidedAt: decided?.at ?? null,
      decidedVia: decided ? "account" : null,
      decidedBy: decided ? ctx.userIds.customer : null,
      decidedAddress: decided ? "198.51.100.24" : null,
      decisionName: decided?.name ?? null,
      createdAt: sentAt,
      updatedAt: decided?.at ?? sentAt,
    })
    .run();
}

/** The demo customer approved the hood scoop's panel in the portal. */
function approvedInPortal(ctx: SeedContext, jobId: number) {
  const job = ctx.db.select().from(jobs).where(eq(jobs.id, jobId)).get()!;
  if (job.approvedPanelId == null) return;
  const panel = ctx.db.select().from(testPanels).where(eq(testPanels.id, job.approvedPanelId)).get()!;
  const sentAt = panel.createdAt + 2 * HOUR;
  signOff(ctx, jobId, panel, sentAt, "customer@demo.coatwright.test", { at: sentAt + 20 * HOUR, name: "Tobias Wren" });
}

/** Another customer's booked candy job: its panel and a deeper one, sent yesterday, waiting for the answer. */
async function waitingPanels(ctx: SeedContext) {
  const candidates = ctx.jobs.filter((j) => j.customerId !== ctx.customerIds[0] && j.stage === "booked");
  for (const j of candidates) {
    const job = ctx.db.select().from(jobs).where(eq(jobs.id, j.id)).get()!;
    if (job.approvedPanelId == null) continue;
    const base = ctx.db.select().from(testPanels).where(eq(testPanels.id, job.approvedPanelId)).get()!;
    const sentAt = ctx.now - DAY;
    const deeperLab = base.labL != null ? { L: base.labL - 3.2, a: (base.labA ?? 0) * 1.04, b: (base.labB ?? 0) * 1.04 } : null;
    const { id: _id, ...copy } = base;
    const deeper = ctx.db
      .insert(testPanels)
      .values({ ...copy, coats: base.coats + 1, labL: deeperLab?.L ?? null, labA: deeperLab?.a ?? null, labB: deeperLab?.b ?? null, notes: "One coat deeper, for the customer to compare.", createdAt: sentAt - 3 * HOUR, updatedAt: sentAt - 3 * HOUR })
      .returning()
      .get();
    if (deeperLab) await addPhoto(ctx, { ownerType: "panel", ownerId: deeper.id, jobId: job.id }, swatchRgb(deeperLab), `deeper-${job.id}.jpg`, { caption: "One coat deeper, daylight", shareable: true, by: j.painterId, at: sentAt - 2 * HOUR, light: "daylight" });
    const to = ctx.db.select({ email: customers.email }).from(customers).where(eq(customers.id, job.customerId)).get()?.email ?? "no-address@example.test";
    signOff(ctx, job.id, base, sentAt, to);
    signOff(ctx, job.id, deeper, sentAt, to);
    return;
  }
}
