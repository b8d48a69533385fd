import type { Shop } from "./test-app";
import type { RequestContext } from "../../server/http/context";
import { createLot, createMaterial } from "../../server/modules/materials/materials.service";
import { createTemplate, startJobPlan } from "../../server/modules/plans/plans.service";
import { createMixSheet } from "../../server/modules/mix-sheets/mix-sheets.service";
import { createMaterialInputSchema } from "../../shared/schemas/material.schema";
import { planDocumentSchema, type PlanDocumentInput } from "../../shared/schemas/plan.schema";
import { createMixSheetInputSchema, type CreateMixSheetInput } from "../../shared/schemas/mix-sheet.schema";
import type { CreateMaterialInput } from "../../shared/schemas/material.schema";

/** The owner's request context, for calling services directly in test setup. */
export function ownerCtx(s: Shop): RequestContext {
  return { actor: { id: s.owner.id, email: s.owner.email, name: "Test owner", role: "owner", customerId: null }, address: "127.0.0.1" };
}

export function addMaterial(s: Shop, input: CreateMaterialInput) {
  return createMaterial(s.app.deps, ownerCtx(s), createMaterialInputSchema.parse(input));
}

export function addTemplate(s: Shop, doc: PlanDocumentInput) {
  return createTemplate(s.app.deps, ownerCtx(s), planDocumentSchema.parse(doc));
}

export function addSheet(s: Shop, input: CreateMixSheetInput) {
  return createMixSheet(s.app.deps, ownerCtx(s), createMixSheetInputSchema.parse(input));
}

/**
 * A small catalogue and plan set on a test shop:
 *  - clear (quart, $95.00), hardener (pint, $60.00, isocyanates), reducer (gallon, $40.00, flammable) — the
 *    reference case of shared/references.md §7 ("RTS material cost"); volume solids 60 / 60 / 0 % so the
 *    4:1:1 mix has 50 % volume solids (references.md §2 job-volume case);
 *  - a spare material nothing uses; a lot of each in use (clear 2 qt, hardener 2 pt, reducer 1 gal);
 *  - a template with one clear layer (4:1:1, 1 coat, 2.0 mil, 65 % transfer efficiency), a plan for job A
 *    (the first painter's job) started from it, and a draft mix sheet of 300 mL on that plan's clear layer.
 */
export function finishFixtures(s: Shop) {
  const clear = addMaterial(s, {
    code: "S9-B04",
    name: "Test urethane clear",
    category: "clear",
    purchaseUnit: "quart",
    costCents: 9500,
    volumeSolidsPct: 60,
    vocGPerL: 500,
    densityGPerMl: 1.0,
    potLifeMinutes: 120,
    containsIsocyanates: false,
    flammable: true,
    lowStockThreshold: 1,
  });
  const hardener = addMaterial(s, {
    code: "S9-B07",
    name: "Test hardener",
    category: "hardener",
    purchaseUnit: "pint",
    costCents: 6000,
    volumeSolidsPct: 60,
    vocGPerL: 300,
    densityGPerMl: 1.1,
    potLifeMinutes: 90,
    containsIsocyanates: true,
    lowStockThreshold: 0.5,
  });
  const reducer = addMaterial(s, {
    code: "S9-B10",
    name: "Test reducer, medium",
    category: "reducer",
    purchaseUnit: "gallon",
    costCents: 4000,
    volumeSolidsPct: 0,
    vocGPerL: 880,
    densityGPerMl: 0.87,
    flammable: true,
    lowStockThreshold: 0.25,
  });
  const spare = addMaterial(s, { code: "S9-B02", name: "Spare additive", category: "additive", purchaseUnit: "floz", costCents: 1200 });
  const deps = s.app.deps;
  const clearLot = createLot(deps, clear.id, { lotNumber: "CL-A1", quantityOnHand: 2, receivedOn: "2026-01-10", expiresOn: "2099-01-01" });
  const hardenerLot = createLot(deps, hardener.id, { lotNumber: "HD-A1", quantityOnHand: 2, receivedOn: "2026-01-10", expiresOn: "2099-01-01" });
  const reducerLot = createLot(deps, reducer.id, { lotNumber: "RD-A1", quantityOnHand: 1, receivedOn: "2026-01-10", expiresOn: null });
  const template = addTemplate(s, {
    name: "Test clear over anything",
    layers: [
      {
        kind: "clear",
        name: "Clear",
        coats: 1,
        flashMinutes: 10,
        dryMinutes: 60,
        dryFilmPerCoat: 2,
        dryFilmUnit: "mil",
        transferEfficiencyPct: 65,
        components: [
          { materialId: clear.id, label: "clear", parts: 4 },
          { materialId: hardener.id, label: "hardener", parts: 1 },
          { materialId: reducer.id, label: "reducer", parts: 1 },
        ],
      },
    ],
  });
  const jobPlan = startJobPlan(deps, ownerCtx(s), s.jobA.id, { fromPlanId: template.id });
  const layer = jobPlan.latest.layers[0]!;
  const sheet = addSheet(s, { jobId: s.jobA.id, layerId: layer.id, mode: "total", amount: 300, unit: "mL" });
  return { clear, hardener, reducer, spare, clearLot, hardenerLot, reducerLot, template, jobPlan, layer, sheet };
}

export type FinishFixtures = ReturnType<typeof finishFixtures>;

const made = new WeakMap<Shop, FinishFixtures>();
/** Fixtures made once per shop (for role-matrix rows: `prepare` makes them, `path` reads them). */
export function fx(s: Shop): FinishFixtures {
  let f = made.get(s);
  if (!f) {
    f = finishFixtures(s);
    made.set(s, f);
  }
  return f;
}

/** A tiny valid PDF (checked by content, not name). */
export const TINY_PDF = Buffer.from(
  "%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[3 0 R]/Count 1>>endobj\n3 0 obj<</Type/Page/Parent 2 0 R/MediaBox[0 0 72 72]>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n",
);

/** Every key anywhere in a JSON value. */
export function keysOf(value: unknown): string[] {
  if (Array.isArray(value)) return value.flatMap(keysOf);
  if (value && typeof value === "object") return Object.entries(value).flatMap(([k, v]) => [k, ...keysOf(v)]);
  return [];
}
/** Names a painter must never receive (money). */
export const MONEY_KEY = /cost|price|cents|margin|markup|rate$/i;
