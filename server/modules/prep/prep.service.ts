import { updateAtVersion } from "../../db/edit-version";
import { aliasedTable, and, asc, eq } from "drizzle-orm";
import type { z } from "zod";
import type { AppDeps } from "../../deps";
import type { Actor } from "../../auth/session";
import { jobItems, prepRecords, users } from "../../db/schema";
import { badRequest, conflict, notFound } from "../../http/http-error";
import { iso, isoOrNull } from "../../http/dates";
import { madeAt } from "../../http/made-at";
import { findJobFor } from "../jobs/jobs.access";
import { photosOf } from "../uploads/uploads.service";
import { missingPrepSteps, PREP_STEP_LABELS, type PrepStatus } from "../../../shared/domain/prep";
import { needsAdhesionPromoter } from "../../../shared/domain/substrates";
import type {
  createPrepRecordInputSchema,
  JobPrepDto,
  PrepRecordDto,
  reopenPrepRecordInputSchema,
  signOffPrepRecordInputSchema,
  updatePrepRecordInputSchema,
} from "../../../shared/schemas/prep.schema";

type PrepRow = typeof prepRecords.$inferSelect;
const preparer = aliasedTable(users, "preparer");
const signer = aliasedTable(users, "signer");

export const prepStatusOf = (row: Pick<PrepRow, "signedOffAt"> | null | undefined): PrepStatus =>
  !row ? "none" : row.signedOffAt ? "signed_off" : "in_progress";

function selectRecords(deps: AppDeps) {
  return deps.db
    .select({ r: prepRecords, itemName: jobItems.name, preparedByName: preparer.name, signedOffByName: signer.name })
    .from(prepRecords)
    .innerJoin(jobItems, eq(prepRecords.itemId, jobItems.id))
    .leftJoin(preparer, eq(prepRecords.preparedBy, preparer.id))
    .leftJoin(signer, eq(prepRecords.signedOffBy, signer.id));
}

type Selected = { r: PrepRow; itemName: string; preparedByName: string | null; signedOffByName: string | null };

function toDto(deps: AppDeps, actor: Actor, rows: Selected[]): PrepRecordDto[] {
  const photos = photosOf(deps, actor, "prep_record", rows.map((x) => x.r.id));
  return rows.map(({ r, itemName, preparedByName, signedOffByName }) => ({
    id: r.id,
    version: r.version,
    jobId: r.jobId,
    itemId: r.itemId,
    itemName,
    substrate: r.substrate,
    needsAdhesionPromoter: needsAdhesionPromoter(r.substrate),
    scuffMedium: r.scuffMedium,
    scuffGrit: r.scuffGrit,
    cleaner: r.cleaner,
    tackCloth: r.tackCloth,
    adhesionPromoter: r.adhesionPromoter,
    adhesionPromoterProduct: r.adhesionPromoterProduct,
    notes: r.notes,
    preparedByName,
    preparedAt: iso(r.preparedAt),
    signedOffByName: r.signedOffAt ? signedOffByName : null,
    signedOffAt: isoOrNull(r.signedOffAt),
    reopenedNote: r.reopenedNote,
    status: prepStatusOf(r),
    missingSteps: missingPrepSteps(r.substrate, r),
    photos: photos.get(r.id) ?? [],
  }));
}

/** The record, if the actor may reach its job (outside reads as 404). */
function findRecord(deps: AppDeps, actor: Actor, id: number): Selected {
  const row = selectRecords(deps).where(eq(prepRecords.id, id)).get();
  if (!row) throw notFound("Prep record");
  try {
    findJobFor(deps, actor, row.r.jobId);
  } catch {
    throw notFound("Prep record");
  }
  return row;
}

export function getPrepRecord(deps: AppDeps, actor: Actor, id: number): PrepRecordDto {
  return toDto(deps, actor, [findRecord(deps, actor, id)])[0]!;
}

export function jobPrep(deps: AppDeps, actor: Actor, jobId: number): JobPrepDto {
  findJobFor(deps, actor, jobId);
  const items = deps.db.select().from(jobItems).where(eq(jobItems.jobId, jobId)).orderBy(asc(jobItems.id)).all();
  const records = toDto(deps, actor, selectRecords(deps).where(eq(prepRecords.jobId, jobId)).all());
  const byItem = new Map(records.map((r) => [r.itemId, r]));
  const list = items.map((item) => {
    const record = byItem.get(item.id) ?? null;
    return {
      itemId: item.id,
      itemName: item.name,
      substrate: item.substrate,
      needsAdhesionPromoter: needsAdhesionPromoter(item.substrate),
      status: record?.status ?? ("none" as const),
      record,
    };
  });
  return { jobId, allSignedOff: list.length > 0 && list.every((i) => i.status === "signed_off"), items: list };
}

/** Only the fields given are written; missing ones keep their value. */
function stepValues(input: Omit<z.output<typeof updatePrepRecordInputSchema>, "version">) {
  const out: Partial<PrepRow> = {};
  for (const key of ["scuffMedium", "scuffGrit", "cleaner", "tackCloth", "adhesionPromoter", "adhesionPromoterProduct", "notes"] as const) {
    if (input[key] !== undefined) (out as Record<string, unknown>)[key] = input[key];
  }
  return out;
}

export function createPrepRecord(deps: AppDeps, actor: Actor, input: z.output<typeof createPrepRecordInputSchema>): PrepRecordDto {
  const item = deps.db.select().from(jobItems).where(eq(jobItems.id, input.itemId)).get();
  if (!item) throw badRequest("That item does not exist", { itemId: "No such item" });
  try {
    findJobFor(deps, actor, item.jobId);
  } catch {
    throw badRequest("That item does not exist", { itemId: "No such item" });
  }
  const existing = deps.db.select({ id: prepRecords.id }).from(prepRecords).where(eq(prepRecords.itemId, item.id)).get();
  if (existing) throw conflict(`${item.name} already has a prep record (#${existing.id}); change that one`, { itemId: "Already has a prep record" });
  const now = deps.now();
  const { itemId: _itemId, ...steps } = input;
  const row = deps.db
    .insert(prepRecords)
    .values({
      jobId: item.jobId,
      itemId: item.id,
      substrate: item.substrate,
      ...stepValues(steps),
      preparedBy: actor.id,
      preparedAt: now,
      createdAt: now,
      updatedAt: now,
    })
    .returning({ id: prepRecords.id })
    .get();
  return getPrepRecord(deps, actor, row.id);
}

export function updatePrepRecord(deps: AppDeps, actor: Actor, id: number, input: z.output<typeof updatePrepRecordInputSchema>): PrepRecordDto {
  const { r } = findRecord(deps, actor, id);
  if (r.signedOffAt) throw conflict("This prep is signed off and can no longer change; the office can reopen it with a reason");
  const now = deps.now();
  updateAtVersion(deps.db, prepRecords, { id, version: input.version, actorId: actor.id, what: "prep record" }, { ...stepValues(input), preparedBy: actor.id, preparedAt: now, updatedAt: now }, () =>
    getPrepRecord(deps, actor, id),
  );
  return getPrepRecord(deps, actor, id);
}

/** Sign-off needs every step the substrate calls for; the refusal names what is missing. */
export function signOffPrepRecord(deps: AppDeps, actor: Actor, id: number, input: z.output<typeof signOffPrepRecordInputSchema> = {}): PrepRecordDto {
  const { r } = findRecord(deps, actor, id);
  if (r.signedOffAt) throw conflict("This prep is already signed off");
  const missing = missingPrepSteps(r.substrate, r);
  if (missing.length) {
    const names = missing.map((s) => PREP_STEP_LABELS[s].toLowerCase());
    throw conflict(`Not ready to sign off: still to record ${names.join(", ")}`, Object.fromEntries(missing.map((s) => [stepField(s), "Not done yet"])));
  }
  const now = deps.now();
  const at = madeAt(input.at, now, [{ time: findJobFor(deps, actor, r.jobId).createdAt, what: "the job was created" }]);
  deps.db.update(prepRecords).set({ signedOffBy: actor.id, signedOffAt: at, updatedAt: now }).where(eq(prepRecords.id, id)).run();
  return getPrepRecord(deps, actor, id);
}

const stepField = (s: string) => (s === "scuff" ? "scuffMedium" : s === "clean" ? "cleaner" : s === "tack" ? "tackCloth" : "adhesionPromoter");

export function reopenPrepRecord(deps: AppDeps, actor: Actor, id: number, input: z.output<typeof reopenPrepRecordInputSchema>): PrepRecordDto {
  const { r } = findRecord(deps, actor, id);
  if (!r.signedOffAt) throw conflict("This prep is not signed off");
  const now = deps.now();
  const stamp = new Date(now).toISOString().slice(0, 16).replace("T", " ");
  const note = `${r.reopenedNote ? `${r.reopenedNote}\n` : ""}${stamp} reopened by ${actor.name}: ${input.reason}`;
  deps.db
    .update(prepRecords)
    .set({ signedOffAt: null, signedOffBy: null, reopenedNote: note.slice(-2000), updatedAt: now })
    .where(and(eq(prepRecords.id, id)))
    .run();
  return getPrepRecord(deps, actor, id);
}
