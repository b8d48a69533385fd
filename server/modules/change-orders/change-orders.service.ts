import { eq } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import type { RequestContext } from "../../http/context";
import { changeOrders, customers, jobs, planVersions, users } from "../../db/schema";
import { updateAtVersion } from "../../db/edit-version";
import { badRequest, conflict, notFound } from "../../http/http-error";
import { iso, isoOrNull } from "../../http/dates";
import { recordAudit } from "../audit/audit.service";
import { findJobFor } from "../jobs/jobs.access";
import { jobPlanRow, latestVersionRow } from "../plans/plans.service";
import { getSettings } from "../settings/settings.service";
import { sendAndLog } from "../messages/messages.service";
import { quoteLink } from "../quotes/quote-sending";
import { composeChangeOrderMail } from "./change-order-mail";
import { approvedQuoteOf, changeDue, totalsOfChange, changeOrdersOf, layerFaces, onTimeline, pairsOf, workingVersionId, type ChangeOrderRow, type Db } from "./change-order-rows";
import { colourChangedIn, isOpenChange } from "../../../shared/domain/change-orders";
import type { QuoteLine } from "../../../shared/quote/index";
import type { ChangeOrderDto, SendChangeOrderInput } from "../../../shared/schemas/change-order.schema";
import type { z } from "zod";
import type { createChangeOrderInputSchema, updateChangeOrderInputSchema } from "../../../shared/schemas/change-order.schema";

/*
 * Change orders, the shop's side: read by staff (painters without money: they see what changes and which layers
 * wait), written by the office. A draft is edited; sending e-mails the customer; the customer answers in the portal
 * (change-order-portal.ts). Every step is audited (kind "money") and written on the job's timeline.
 */

export { totalsOfChange };

/** A change order's extra deposit received so far (see changeDue). */
export const paidCentsForChange = (db: Db, changeOrderId: number) => changeDue(db, changeOrderId)?.paidCents ?? 0;

const versionRef = (db: Db, id: number | null) => (id == null ? null : (db.select({ id: planVersions.id, version: planVersions.version }).from(planVersions).where(eq(planVersions.id, id)).get() ?? null));

/** The DTO; `money` for the office and the customer, `forShop` adds the address the customer answered from. */
export function toChangeOrderDto(deps: Pick<AppDeps, "db">, c: ChangeOrderRow, opts: { money: boolean; forShop: boolean }): ChangeOrderDto {
  const db = deps.db;
  const job = db.select({ id: jobs.id, title: jobs.title, sprayedPlanVersionId: jobs.sprayedPlanVersionId }).from(jobs).where(eq(jobs.id, c.jobId)).get()!;
  const layers = pairsOf(db, c);
  const by = c.createdBy ? (db.select({ name: users.name }).from(users).where(eq(users.id, c.createdBy)).get()?.name ?? null) : null;
  const working = workingVersionId(db, job);
  const dto: ChangeOrderDto = {
    id: c.id,
    jobId: c.jobId,
    jobTitle: job.title,
    kind: c.kind,
    status: c.status,
    summary: c.summary,
    colourChanged: c.colourChanged,
    fromVersion: versionRef(db, c.fromVersionId),
    toVersion: versionRef(db, c.toVersionId),
    layers,
    affectedLayerIds: !isOpenChange(c.status)
      ? []
      : c.fromVersionId != null
        ? layers.filter((p) => p.changed && p.before && c.fromVersionId === working).map((p) => p.before!.id)
        : layerFaces(db, working ?? job.sprayedPlanVersionId).map((l) => l.id),
    sentAt: isoOrNull(c.sentAt),
    sentTo: opts.forShop ? c.sentTo : null,
    decidedAt: isoOrNull(c.decidedAt),
    decidedVia: c.decidedVia,
    decisionName: c.decisionName,
    decisionNote: c.decisionNote,
    decidedAddress: opts.forShop ? c.decidedAddress : null,
    createdAt: iso(c.createdAt),
    createdByName: by,
    version: c.version,
  };
  if (opts.money) {
    const t = totalsOfChange(c);
    dto.money = {
      lines: c.lines,
      lineCents: t.lines.map((l) => l.amountCents),
      subtotalCents: t.subtotalCents,
      taxCents: t.taxCents,
      taxPercent: c.taxPercent,
      totalCents: t.totalCents,
      depositPercent: c.depositPercent,
      depositCents: Math.max(0, t.depositCents),
      paidCents: paidCentsForChange(db, c.id),
    };
  }
  return dto;
}

const isOffice = (actor: Actor) => actor.role === "owner" || actor.role === "estimator";
const shopDto = (deps: AppDeps, actor: Actor, c: ChangeOrderRow) => toChangeOrderDto(deps, c, { money: isOffice(actor), forShop: true });

export function listJobChangeOrders(deps: AppDeps, actor: Actor, jobId: number): { items: ChangeOrderDto[] } {
  const job = findJobFor(deps, actor, jobId);
  return { items: changeOrdersOf(deps.db, job.id).reverse().map((c) => shopDto(deps, actor, c)) };
}

/** A change order the staff member may reach (through its job's scope), else 404. */
function reachable(deps: AppDeps, actor: Actor, id: number): ChangeOrderRow {
  const c = deps.db.select().from(changeOrders).where(eq(changeOrders.id, id)).get();
  if (!c) throw notFound("Change order");
  try {
    findJobFor(deps, actor, c.jobId);
  } catch {
    throw notFound("Change order");
  }
  return c;
}

export function getChangeOrder(deps: AppDeps, actor: Actor, id: number): ChangeOrderDto {
  return shopDto(deps, actor, reachable(deps, actor, id));
}

const moneyOf = (c: Pick<ChangeOrderRow, "lines" | "taxPercent" | "taxedKinds" | "depositPercent" | "taxRounding">) => {
  const t = totalsOfChange(c);
  return { totalCents: t.totalCents, depositCents: Math.max(0, t.depositCents) };
};

/** Opens a change order on a job the customer approved. A plan change goes from the version the job works from to the given (or latest) version. */
export function createChangeOrder(deps: AppDeps, ctx: RequestContext, jobId: number, input: z.output<typeof createChangeOrderInputSchema>): ChangeOrderDto {
  const job = findJobFor(deps, ctx.actor, jobId);
  const approved = approvedQuoteOf(deps.db, job.id);
  if (!approved) throw conflict("Change orders are for jobs the customer has approved; change the quote instead", { jobId: "No approved quote" });
  let fromVersionId: number | null = null;
  let toVersionId: number | null = null;
  if (input.kind === "plan") {
    const plan = jobPlanRow(deps.db, job.id);
    if (!plan) throw badRequest("The job has no finish plan", { planVersionId: "No plan on this job" });
    toVersionId = input.planVersionId ?? latestVersionRow(deps.db, plan.id).id;
    const to = deps.db.select().from(planVersions).where(eq(planVersions.id, toVersionId)).get();
    if (!to || to.planId !== plan.id) throw badRequest("That version is not of this job's plan", { planVersionId: "Not a version of this job's plan" });
    fromVersionId = workingVersionId(deps.db, job) ?? job.sprayedPlanVersionId;
    if (fromVersionId == null || fromVersionId === toVersionId) throw badRequest("Save the changed plan first: the new version is what the customer approves", { planVersionId: "The same version the job works from" });
    if (changeOrdersOf(deps.db, job.id).some((c) => c.status === "draft" && c.kind === "plan"))
      throw conflict("A plan change for this job is already being prepared; edit that one", { kind: "Draft plan change exists" });
  }
  const lines = (input.lines ?? []) as QuoteLine[];
  const terms = { lines, taxPercent: approved.taxPercent, taxedKinds: approved.taxedKinds, taxRounding: approved.taxRounding, depositPercent: approved.depositPercent };
  const colourChanged = input.colourChanged ?? (fromVersionId != null ? colourChangedIn(pairsOf(deps.db, { fromVersionId, toVersionId })) : false);
  const now = deps.now();
  const id = deps.db.transaction((tx) => {
    const row = tx
      .insert(changeOrders)
      .values({ jobId: job.id, quoteId: approved.quoteId, kind: input.kind, summary: input.summary, colourChanged, fromVersionId, toVersionId, ...terms, ...moneyOf(terms), createdBy: ctx.actor.id, createdAt: now, updatedAt: now, updatedBy: ctx.actor.id })
      .returning({ id: changeOrders.id })
      .get();
    recordAudit(tx, ctx, { kind: "money", entity: "change_order", entityId: row.id, action: "created", after: { jobId: job.id, kind: input.kind, summary: input.summary, colourChanged, fromVersionId, toVersionId, ...moneyOf(terms) } }, now);
    onTimeline(tx, job.id, `Change order #${row.id} opened: ${input.summary}`, ctx.actor.id, now);
    return row.id;
  });
  return getChangeOrder(deps, ctx.actor, id);
}

/** Edits a draft (what changed, the colour flag, the price lines). A sent change order is the customer's to answer. */
export function updateChangeOrder(deps: AppDeps, ctx: RequestContext, id: number, input: z.output<typeof updateChangeOrderInputSchema>): ChangeOrderDto {
  const c = reachable(deps, ctx.actor, id);
  if (c.status !== "draft") throw conflict("Only a change order that was not sent yet can be edited", { status: c.status });
  const next = { ...c, summary: input.summary ?? c.summary, colourChanged: input.colourChanged ?? c.colourChanged, lines: (input.lines as QuoteLine[] | undefined) ?? c.lines };
  const now = deps.now();
  deps.db.transaction((tx) => {
    updateAtVersion(tx, changeOrders, { id, version: input.version, actorId: ctx.actor.id, what: "change order" }, { summary: next.summary, colourChanged: next.colourChanged, lines: next.lines, ...moneyOf(next), updatedAt: now }, () => shopDto(deps, ctx.actor, c));
    recordAudit(tx, ctx, { kind: "money", entity: "change_order", entityId: id, action: "updated", before: { summary: c.summary, colourChanged: c.colourChanged, ...moneyOf(c) }, after: { summary: next.summary, colourChanged: next.colourChanged, ...moneyOf(next) } }, now);
  });
  return getChangeOrder(deps, ctx.actor, id);
}

/**
 * E-mails the change order to the customer with a link to answer it in the portal, then marks it sent. If the mail
 * server refuses, nothing is marked (the attempt is logged on the job). Sending again re-sends the same change.
 */
export async function sendChangeOrder(deps: AppDeps, ctx: RequestContext, id: number, input: SendChangeOrderInput): Promise<ChangeOrderDto> {
  const c = reachable(deps, ctx.actor, id);
  if (c.status !== "draft" && c.status !== "sent") throw conflict(`The customer already ${c.status} this change order`, { status: c.status });
  const job = findJobFor(deps, ctx.actor, c.jobId);
  const customer = deps.db.select().from(customers).where(eq(customers.id, job.customerId)).get()!;
  const to = input.to ?? customer.email;
  if (!to) throw badRequest("The customer has no e-mail address on file; enter one to send to", { to: "Enter an e-mail address" });
  const approved = approvedQuoteOf(deps.db, job.id);
  // The signed quote link opens the change order too (no sign-in needed); a signed-in customer finds it in the portal.
  const link = approved ? `${quoteLink(deps, approved.quoteId, approved.validUntil).url}?change=${id}` : `${deps.publicUrl}/portal/change-orders/${id}`;
  const t = totalsOfChange(c);
  const mail = composeChangeOrderMail({ shop: getSettings(deps), customerName: customer.name, jobTitle: job.title, changeOrderId: id, summary: c.summary, totalCents: t.totalCents, depositCents: Math.max(0, t.depositCents), colourChanged: c.colourChanged, link, message: input.message ?? null });
  await sendAndLog(deps, { jobId: job.id, kind: "change_order", sentBy: ctx.actor.id }, { to, ...mail });
  const now = deps.now();
  deps.db.transaction((tx) => {
    tx.update(changeOrders).set({ status: "sent", sentAt: now, sentTo: to, sentBy: ctx.actor.id, updatedAt: now, version: c.version + 1, updatedBy: ctx.actor.id }).where(eq(changeOrders.id, id)).run();
    recordAudit(tx, ctx, { kind: "money", entity: "change_order", entityId: id, action: c.status === "draft" ? "sent" : "resent", after: { to, totalCents: t.totalCents, depositCents: Math.max(0, t.depositCents) } }, now);
    onTimeline(tx, job.id, `Change order #${id} sent to the customer (${to})`, ctx.actor.id, now);
  });
  return getChangeOrder(deps, ctx.actor, id);
}
