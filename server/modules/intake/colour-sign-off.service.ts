import { and, asc, desc, eq, inArray, isNotNull } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import type { RequestContext } from "../../http/context";
import { customers, jobs, panelSignOffs, quoteVersions, quotes, testPanels, uploads } from "../../db/schema";
import { nextVersion } from "../../db/edit-version";
import { badRequest, conflict, notFound } from "../../http/http-error";
import { recordAudit } from "../audit/audit.service";
import { getSettings } from "../settings/settings.service";
import { sendAndLog } from "../messages/messages.service";
import { composeColourMail } from "../messages/compose";
import { findJobFor } from "../jobs/jobs.access";
import { jobColour, labOf, panelLabel } from "../panels/panels.service";
import { quoteLink } from "../quotes/quote-sending";
import { photoUrl } from "../portal/portal.service";
import type { PortalViewer } from "../portal/portal-viewer";
import { customerApprovedColour, signOffsOf, toSignOffDto } from "./sign-off-rows";
import { deltaE2000 } from "../../../shared/mix/index";
import type { JobColourDto, Lab } from "../../../shared/schemas/panel.schema";
import type { PortalColourDto, sendPanelsInputSchema } from "../../../shared/schemas/colour-sign-off.schema";

type SignOffRow = typeof panelSignOffs.$inferSelect;
type PanelRow = typeof testPanels.$inferSelect;
const num = (n: number) => String(Number(n.toFixed(3)));

/** The photo a panel is sent with: its daylight photo when it has one, else its first. */
function panelPhotoId(deps: AppDeps, panelId: number): number | null {
  const photos = deps.db
    .select({ id: uploads.id, light: uploads.light })
    .from(uploads)
    .where(and(eq(uploads.ownerType, "panel"), eq(uploads.ownerId, panelId), eq(uploads.kind, "photo")))
    .orderBy(asc(uploads.createdAt), asc(uploads.id))
    .all();
  return (photos.find((p) => p.light === "daylight") ?? photos[0])?.id ?? null;
}

/** The link in the e-mail: the signed quote link when the job has a quote out (it opens the job too), else the portal. */
function portalLinkFor(deps: AppDeps, jobId: number): string {
  const offered = deps.db
    .select({ quoteId: quotes.id, validUntil: quoteVersions.validUntil })
    .from(quoteVersions)
    .innerJoin(quotes, eq(quoteVersions.quoteId, quotes.id))
    .where(and(eq(quotes.jobId, jobId), isNotNull(quoteVersions.sentAt)))
    .orderBy(desc(quoteVersions.sentAt))
    .limit(1)
    .get();
  return offered ? `${quoteLink(deps, offered.quoteId, offered.validUntil).url}?colour=1` : `${deps.publicUrl}/portal/jobs/${jobId}/colour`;
}

/**
 * Sends one or more test panels of a job to its customer to approve, each with its photo, let-down, coats and ΔE00
 * to the target. The e-mail goes first: if the mail server refuses it, nothing is recorded as sent (the attempt is
 * logged on the job). A panel sent again replaces its earlier offer. The photos sent become visible to the customer.
 */
export async function sendPanelsToCustomer(deps: AppDeps, ctx: RequestContext, panelId: number, input: z.output<typeof sendPanelsInputSchema>): Promise<JobColourDto> {
  const first = deps.db.select().from(testPanels).where(eq(testPanels.id, panelId)).get();
  if (!first) throw notFound("Test panel");
  if (first.jobId == null) throw conflict("This panel is not linked to a job; link it to the customer's job before sending it", { jobId: "Not linked to a job" });
  const job = findJobFor(deps, ctx.actor, first.jobId);
  const others = input.alsoPanelIds?.filter((id) => id !== panelId) ?? [];
  const more = others.length ? deps.db.select().from(testPanels).where(inArray(testPanels.id, others)).all() : [];
  const strangers = others.filter((id) => more.find((p) => p.id === id)?.jobId !== job.id);
  if (strangers.length) throw badRequest(`Only panels of job #${job.id} go in one sending`, { alsoPanelIds: `Not panels of job #${job.id}: ${strangers.map((i) => `#${i}`).join(", ")}` });
  const panels: PanelRow[] = [first, ...others.map((id) => more.find((p) => p.id === id)!)];
  const photos = new Map(panels.map((p) => [p.id, panelPhotoId(deps, p.id)]));
  const bare = panels.filter((p) => photos.get(p.id) == null);
  if (bare.length) throw badRequest("Each panel is sent with its photo", { photo: `Add a photo to panel ${bare.map((p) => `#${p.id}`).join(", ")} first` });
  const customer = deps.db.select().from(customers).where(eq(customers.id, job.customerId)).get()!;
  const to = input.to ?? customer.email;
  if (!to) throw badRequest("The customer has no e-mail address on file; enter one to send to", { to: "Enter an e-mail address" });

  const approved = job.approvedPanelId != null ? deps.db.select().from(testPanels).where(eq(testPanels.id, job.approvedPanelId)).get() : undefined;
  const target: { label: string; lab: Lab | null } | null = input.target
    ? { label: input.target.label, lab: { L: input.target.labL, a: input.target.labA, b: input.target.labB } }
    : approved
      ? { label: `the agreed panel #${approved.id}`, lab: labOf(approved) }
      : null;
  const deltaOf = (p: PanelRow) => {
    const lab = labOf(p);
    return target?.lab && lab ? Math.round(deltaE2000(target.lab, lab) * 100) / 100 : null;
  };
  const mail = composeColourMail({
    shop: getSettings(deps),
    customerName: customer.name,
    jobTitle: job.title,
    jobId: job.id,
    panels: panels.map((p) => ({ label: panelLabel(p), letDown: `${num(p.letDownClear)} : ${num(p.letDownToner)}`, coats: p.coats, deltaE: deltaOf(p) })),
    targetLabel: target?.label ?? null,
    link: portalLinkFor(deps, job.id),
    message: input.message ?? null,
  });
  await sendAndLog(deps, { jobId: job.id, kind: "colour_panels", sentBy: ctx.actor.id }, { to, ...mail });

  const now = deps.now();
  deps.db.transaction((tx) => {
    const ids = panels.map((p) => p.id);
    tx.update(panelSignOffs)
      .set({ status: "replaced", updatedAt: now, ...nextVersion(panelSignOffs, ctx.actor.id) })
      .where(and(eq(panelSignOffs.jobId, job.id), inArray(panelSignOffs.panelId, ids), eq(panelSignOffs.status, "waiting")))
      .run();
    for (const p of panels) {
      tx.insert(panelSignOffs)
        .values({
          jobId: job.id,
          panelId: p.id,
          label: panelLabel(p),
          letDownClear: p.letDownClear,
          letDownToner: p.letDownToner,
          coats: p.coats,
          photoId: photos.get(p.id)!,
          targetLabel: target?.label ?? null,
          deltaE: deltaOf(p),
          message: input.message ?? null,
          sentTo: to,
          sentBy: ctx.actor.id,
          sentAt: now,
          createdAt: now,
          updatedAt: now,
          updatedBy: ctx.actor.id,
        })
        .run();
      tx.update(uploads).set({ shareable: true, ...nextVersion(uploads, ctx.actor.id) }).where(and(eq(uploads.id, photos.get(p.id)!), eq(uploads.shareable, false))).run();
    }
    recordAudit(tx, ctx, { kind: "plan", entity: "job_colour", entityId: job.id, action: "sent_to_customer", after: { panelIds: ids, to, target: target?.label ?? null } }, now);
  });
  return jobColour(deps, ctx.actor, job.id);
}

/** The viewer's job (their own; with a link, only the link's job). */
function portalJob(deps: AppDeps, viewer: PortalViewer, jobId: number) {
  if (viewer.via === "link" && viewer.jobId !== jobId) throw notFound("Job");
  const job = deps.db.select().from(jobs).where(and(eq(jobs.id, jobId), eq(jobs.customerId, viewer.customerId))).get();
  if (!job) throw notFound("Job");
  return job;
}

export function portalColour(deps: AppDeps, viewer: PortalViewer, jobId: number): PortalColourDto {
  const job = portalJob(deps, viewer, jobId);
  const rows = signOffsOf(deps, job.id).filter((r) => r.status !== "replaced");
  const dto = (r: SignOffRow) => toSignOffDto(r, (id, thumb) => photoUrl(viewer, id, thumb), false);
  return {
    jobId: job.id,
    jobTitle: job.title,
    approvedPanelId: customerApprovedColour(deps, job) ? job.approvedPanelId : null,
    waiting: rows.filter((r) => r.status === "waiting").map(dto),
    answered: rows.filter((r) => r.status !== "waiting").map(dto),
  };
}

/**
 * The customer approves one of the panels waiting for them: recorded with the time, how (account or link), their
 * name and address, like a quote approval. That panel becomes the job's agreed colour; the others sent with it are
 * marked not chosen.
 */
export function approvePanel(deps: AppDeps, viewer: PortalViewer, panelId: number, input: { name: string; note?: string | null }, address: string | null): PortalColourDto {
  const rows = deps.db
    .select({ s: panelSignOffs })
    .from(panelSignOffs)
    .innerJoin(jobs, eq(panelSignOffs.jobId, jobs.id))
    .where(and(eq(panelSignOffs.panelId, panelId), eq(jobs.customerId, viewer.customerId), viewer.via === "link" ? eq(jobs.id, viewer.jobId) : undefined))
    .orderBy(desc(panelSignOffs.sentAt), desc(panelSignOffs.id))
    .all()
    .map((r) => r.s);
  if (!rows.length) throw notFound("Test panel");
  const offer = rows.find((r) => r.status === "waiting");
  if (!offer) {
    const latest = rows[0]!;
    throw conflict(latest.status === "approved" ? "You already approved this panel" : "This panel is no longer waiting for your answer; the shop has sent newer panels", { panelId: latest.status });
  }
  const now = deps.now();
  deps.db.transaction((tx) => {
    const job = tx.select().from(jobs).where(eq(jobs.id, offer.jobId)).get()!;
    const actorId = viewer.via === "account" ? viewer.userId : null;
    const done = tx
      .update(panelSignOffs)
      .set({ status: "approved", decidedAt: now, decidedVia: viewer.via, decidedBy: actorId, decidedAddress: address, decisionName: input.name, decisionNote: input.note ?? null, updatedAt: now, ...nextVersion(panelSignOffs, actorId) })
      .where(and(eq(panelSignOffs.id, offer.id), eq(panelSignOffs.status, "waiting")))
      .run();
    if (done.changes !== 1) throw conflict("This panel was answered a moment ago; reload to see it", { panelId: "Answered" });
    tx.update(panelSignOffs)
      .set({ status: "not_chosen", decidedAt: now, updatedAt: now, ...nextVersion(panelSignOffs, actorId) })
      .where(and(eq(panelSignOffs.jobId, offer.jobId), eq(panelSignOffs.status, "waiting")))
      .run();
    tx.update(jobs).set({ approvedPanelId: panelId, updatedAt: now }).where(eq(jobs.id, offer.jobId)).run();
    const ctx = viewer.via === "account" ? { actor: { id: viewer.userId, name: viewer.name, email: "", role: "customer" as const, customerId: viewer.customerId }, address } : null;
    recordAudit(
      tx,
      ctx,
      {
        kind: "plan",
        entity: "job_colour",
        entityId: offer.jobId,
        action: "customer_approved",
        before: { approvedPanelId: job.approvedPanelId },
        after: { approvedPanelId: panelId, via: viewer.via, name: input.name, address },
      },
      now,
    );
  });
  return portalColour(deps, viewer, offer.jobId);
}
