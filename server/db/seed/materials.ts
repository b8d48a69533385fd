import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import type { RequestContext } from "../../http/context";
import { jobItems, jobStageEvents, materialLots, users } from "../schema";
import { createLot, createMaterial } from "../../modules/materials/materials.service";
import { createTemplate, startJobPlan, savePlan } from "../../modules/plans/plans.service";
import { estimateLayer, jobAreaM2 } from "../../modules/plans/plan-estimate.service";
import { loadPlanVersion } from "../../modules/plans/plans.service";
import { createMixSheet, recordMixSheet } from "../../modules/mix-sheets/mix-sheets.service";
import { createMaterialInputSchema, type CreateMaterialInput } from "../../../shared/schemas/material.schema";
import { planDocumentSchema, savePlanInputSchema, type PlanDocumentInput, type PlanLayerInput } from "../../../shared/schemas/plan.schema";
import type { Stage } from "../../../shared/domain/stages";
import type { SeedContext } from "./core";

/*
 * The demo catalogue, finish-plan templates, job plans and recorded batches. Every material is invented:
 * generic names and the shop's own stock numbers (shelf and bin: "S4-B02" is shelf 4, bin 2); the figures are realistic but made up (never a maker's data).
 */

type MaterialSeed = CreateMaterialInput & { lots: { lot: string; qty: number; receivedDaysAgo: number; expiresInDays: number | null }[] };

const CATALOGUE: MaterialSeed[] = [
  // Cleaners and adhesion promoter
  { code: "S1-B01", name: "Wax and grease remover", category: "cleaner", purchaseUnit: "gallon", costCents: 3600, volumeSolidsPct: 0, vocGPerL: 690, densityGPerMl: 0.76, flammable: true, lowStockThreshold: 0.5, lots: [{ lot: "WG-2611", qty: 1.6, receivedDaysAgo: 40, expiresInDays: 900 }] },
  { code: "S1-B02", name: "Waterborne final wipe", category: "cleaner", purchaseUnit: "gallon", costCents: 2900, volumeSolidsPct: 0, vocGPerL: 210, waterExemptPct: 88, densityGPerMl: 1.0, lowStockThreshold: 0.5, lots: [{ lot: "FW-2609", qty: 0.4, receivedDaysAgo: 95, expiresInDays: 400 }] },
  { code: "S1-B03", name: "Gun wash solvent", category: "cleaner", purchaseUnit: "gallon", costCents: 2400, volumeSolidsPct: 0, vocGPerL: 880, densityGPerMl: 0.85, flammable: true, lowStockThreshold: 1, lots: [{ lot: "GW-2610", qty: 3, receivedDaysAgo: 35, expiresInDays: null }] },
  { code: "S1-B04", name: "Plastic adhesion promoter, clear", category: "adhesion_promoter", purchaseUnit: "quart", costCents: 4200, volumeSolidsPct: 6, vocGPerL: 720, densityGPerMl: 0.82, flammable: true, lowStockThreshold: 1, lots: [{ lot: "AP-2607", qty: 3, receivedDaysAgo: 120, expiresInDays: 500 }] },
  // Sealers
  { code: "S2-B01", name: "Urethane sealer, white", category: "sealer", purchaseUnit: "quart", costCents: 5600, volumeSolidsPct: 52, vocGPerL: 410, densityGPerMl: 1.42, potLifeMinutes: 60, recoatMaxMinutes: 4320, lowStockThreshold: 1, lots: [{ lot: "SW-2608", qty: 4, receivedDaysAgo: 110, expiresInDays: 600 }] },
  { code: "S2-B02", name: "Urethane sealer, grey", category: "sealer", purchaseUnit: "quart", costCents: 5400, volumeSolidsPct: 50, vocGPerL: 415, densityGPerMl: 1.38, potLifeMinutes: 60, recoatMaxMinutes: 4320, lowStockThreshold: 1, lots: [{ lot: "SG-2605", qty: 2, receivedDaysAgo: 180, expiresInDays: 360 }, { lot: "SG-2610", qty: 4, receivedDaysAgo: 50, expiresInDays: 700 }] },
  { code: "S2-B03", name: "Urethane sealer, black", category: "sealer", purchaseUnit: "quart", costCents: 5400, volumeSolidsPct: 50, vocGPerL: 418, densityGPerMl: 1.3, potLifeMinutes: 60, recoatMaxMinutes: 4320, lowStockThreshold: 1, lots: [{ lot: "SB-2606", qty: 3, receivedDaysAgo: 150, expiresInDays: 550 }] },
  // Ground coats
  { code: "S3-B01", name: "Solid ground, bright white", category: "ground_coat", purchaseUnit: "quart", costCents: 6800, volumeSolidsPct: 24, vocGPerL: 580, densityGPerMl: 1.12, recoatMaxMinutes: 1440, lowStockThreshold: 1, lots: [{ lot: "GW-2608", qty: 4, receivedDaysAgo: 100, expiresInDays: 730 }] },
  { code: "S3-B02", name: "Solid ground, jet black", category: "ground_coat", purchaseUnit: "quart", costCents: 6200, volumeSolidsPct: 22, vocGPerL: 590, densityGPerMl: 0.98, recoatMaxMinutes: 1440, lowStockThreshold: 1, lots: [{ lot: "GB-2609", qty: 3, receivedDaysAgo: 90, expiresInDays: 730 }] },
  { code: "S3-B10", name: "Metallic ground, fine silver", category: "ground_coat", purchaseUnit: "quart", costCents: 8900, volumeSolidsPct: 18, vocGPerL: 610, densityGPerMl: 0.96, recoatMaxMinutes: 1440, lowStockThreshold: 1, lots: [{ lot: "MS-2606", qty: 3, receivedDaysAgo: 160, expiresInDays: 540 }, { lot: "MS-2611", qty: 4, receivedDaysAgo: 30, expiresInDays: 730 }] },
  { code: "S3-B11", name: "Metallic ground, bright gold", category: "ground_coat", purchaseUnit: "quart", costCents: 9400, volumeSolidsPct: 18, vocGPerL: 612, densityGPerMl: 0.97, recoatMaxMinutes: 1440, lowStockThreshold: 1, lots: [{ lot: "MG-2607", qty: 4, receivedDaysAgo: 130, expiresInDays: 600 }] },
  { code: "S3-B20", name: "Solid colour, teal", category: "ground_coat", purchaseUnit: "quart", costCents: 7400, volumeSolidsPct: 26, vocGPerL: 575, densityGPerMl: 1.05, recoatMaxMinutes: 1440, lowStockThreshold: 0.5, lots: [{ lot: "ST-2610", qty: 2, receivedDaysAgo: 60, expiresInDays: 700 }] },
  // Candy toners (concentrates let down in intercoat clear)
  { code: "S4-B01", name: "Candy toner, apple red", category: "toner", purchaseUnit: "pint", costCents: 7800, volumeSolidsPct: 32, vocGPerL: 560, densityGPerMl: 0.95, lowStockThreshold: 1, lots: [{ lot: "TR-2606", qty: 3, receivedDaysAgo: 170, expiresInDays: 500 }] },
  { code: "S4-B02", name: "Candy toner, cobalt", category: "toner", purchaseUnit: "pint", costCents: 8200, volumeSolidsPct: 30, vocGPerL: 565, densityGPerMl: 0.94, lowStockThreshold: 1, lots: [{ lot: "TC-2608", qty: 3, receivedDaysAgo: 100, expiresInDays: 500 }] },
  { code: "S4-B03", name: "Candy toner, tangerine", category: "toner", purchaseUnit: "pint", costCents: 7800, volumeSolidsPct: 31, vocGPerL: 560, densityGPerMl: 0.95, lowStockThreshold: 1, lots: [{ lot: "TT-2607", qty: 2, receivedDaysAgo: 140, expiresInDays: 480 }] },
  { code: "S4-B04", name: "Candy toner, emerald", category: "toner", purchaseUnit: "pint", costCents: 8200, volumeSolidsPct: 30, vocGPerL: 568, densityGPerMl: 0.94, lowStockThreshold: 1, lots: [{ lot: "TE-2609", qty: 3, receivedDaysAgo: 80, expiresInDays: 520 }] },
  { code: "S4-B05", name: "Candy toner, violet", category: "toner", purchaseUnit: "pint", costCents: 8400, volumeSolidsPct: 30, vocGPerL: 566, densityGPerMl: 0.94, lowStockThreshold: 1, lots: [{ lot: "TV-2609", qty: 2, receivedDaysAgo: 85, expiresInDays: 520 }] },
  { code: "S4-B06", name: "Candy toner, root beer", category: "toner", purchaseUnit: "pint", costCents: 7900, volumeSolidsPct: 31, vocGPerL: 562, densityGPerMl: 0.95, lowStockThreshold: 1, lots: [{ lot: "TB-2604", qty: 0.5, receivedDaysAgo: 220, expiresInDays: -10 }, { lot: "TB-2610", qty: 3, receivedDaysAgo: 45, expiresInDays: 600 }] },
  // Intercoat clear
  { code: "S5-B01", name: "Intercoat clear", category: "intercoat_clear", purchaseUnit: "gallon", costCents: 11800, volumeSolidsPct: 22, vocGPerL: 600, densityGPerMl: 0.93, recoatMaxMinutes: 1440, lowStockThreshold: 0.5, lots: [{ lot: "IC-2606", qty: 1, receivedDaysAgo: 170, expiresInDays: 500 }, { lot: "IC-2611", qty: 2, receivedDaysAgo: 25, expiresInDays: 730 }] },
  // Reducers
  { code: "S6-B01", name: "Urethane reducer, fast", category: "reducer", purchaseUnit: "gallon", costCents: 4200, volumeSolidsPct: 0, vocGPerL: 870, densityGPerMl: 0.86, flammable: true, lowStockThreshold: 0.5, lots: [{ lot: "RF-2609", qty: 1.5, receivedDaysAgo: 90, expiresInDays: null }] },
  { code: "S6-B02", name: "Urethane reducer, medium", category: "reducer", purchaseUnit: "gallon", costCents: 4000, volumeSolidsPct: 0, vocGPerL: 875, densityGPerMl: 0.87, flammable: true, lowStockThreshold: 1, lots: [{ lot: "RM-2605", qty: 2, receivedDaysAgo: 190, expiresInDays: null }, { lot: "RM-2611", qty: 3, receivedDaysAgo: 20, expiresInDays: null }] },
  { code: "S6-B03", name: "Urethane reducer, slow", category: "reducer", purchaseUnit: "gallon", costCents: 4300, volumeSolidsPct: 0, vocGPerL: 880, densityGPerMl: 0.88, flammable: true, lowStockThreshold: 0.5, lots: [{ lot: "RS-2608", qty: 0.45, receivedDaysAgo: 110, expiresInDays: null }] },
  // Hardeners (isocyanates)
  { code: "S6-B11", name: "Sealer hardener", category: "hardener", purchaseUnit: "pint", costCents: 4600, volumeSolidsPct: 62, vocGPerL: 310, densityGPerMl: 1.06, potLifeMinutes: 60, containsIsocyanates: true, flammable: true, lowStockThreshold: 1, lots: [{ lot: "HS-2607", qty: 4, receivedDaysAgo: 120, expiresInDays: 300 }] },
  { code: "S6-B12", name: "Urethane hardener, standard", category: "hardener", purchaseUnit: "quart", costCents: 8800, volumeSolidsPct: 66, vocGPerL: 290, densityGPerMl: 1.08, potLifeMinutes: 150, containsIsocyanates: true, flammable: true, lowStockThreshold: 1, lots: [{ lot: "HU-2608", qty: 2, receivedDaysAgo: 100, expiresInDays: 330 }, { lot: "HU-2611", qty: 3, receivedDaysAgo: 28, expiresInDays: 360 }] },
  // Clears (2K urethane: activated with the hardener)
  { code: "S5-B02", name: "2K urethane clear, high gloss", category: "clear", purchaseUnit: "gallon", costCents: 24500, volumeSolidsPct: 56, vocGPerL: 395, densityGPerMl: 1.01, potLifeMinutes: 180, containsIsocyanates: true, flammable: true, lowStockThreshold: 1, lots: [{ lot: "CG-2607", qty: 1.5, receivedDaysAgo: 130, expiresInDays: 400 }, { lot: "CG-2611", qty: 3, receivedDaysAgo: 22, expiresInDays: 540 }] },
  { code: "S5-B03", name: "2K urethane clear, satin", category: "clear", purchaseUnit: "quart", costCents: 7400, volumeSolidsPct: 52, vocGPerL: 410, densityGPerMl: 1.04, potLifeMinutes: 150, containsIsocyanates: true, flammable: true, lowStockThreshold: 1, lots: [{ lot: "CS-2609", qty: 2, receivedDaysAgo: 75, expiresInDays: 450 }] },
  // Additives
  { code: "S7-B01", name: "Flex additive for plastics", category: "additive", purchaseUnit: "quart", costCents: 5200, volumeSolidsPct: 45, vocGPerL: 380, densityGPerMl: 1.0, lowStockThreshold: 0.5, lots: [{ lot: "FX-2608", qty: 2, receivedDaysAgo: 110, expiresInDays: 500 }] },
  { code: "S7-B05", name: "Metal flake, fine silver", category: "additive", purchaseUnit: "oz", costCents: 1400, volumeSolidsPct: 100, vocGPerL: 0, densityGPerMl: 2.6, lowStockThreshold: 4, notes: "Sold by weight; mixed by volume through its density.", lots: [{ lot: "FL-2610", qty: 12, receivedDaysAgo: 55, expiresInDays: null }] },
];

const DAY = 86_400_000;

type Codes = Record<string, number>;

const comp = (materialId: number, label: string, amount: { parts?: number; percent?: number; percentOf?: string[] }) => ({ materialId, label, ...amount });

function prepLayer(): PlanLayerInput {
  return { kind: "prep", name: "Scuff, clean and tack", coats: 1, flashMinutes: 10, dryMinutes: 10, notes: "Scuff with grey pad, wax and grease remover, final wipe, tack rag just before sealing.", components: [] };
}

function sealerLayer(m: Codes, code: string): PlanLayerInput {
  return {
    kind: "sealer",
    name: "Sealer",
    coats: 1,
    flashMinutes: 10,
    dryMinutes: 45,
    gunTip: "1.4 mm",
    pressurePsi: 26,
    overlapPct: 75,
    dryFilmPerCoat: 38,
    dryFilmUnit: "um",
    transferEfficiencyPct: 65,
    components: [comp(m[code]!, "sealer", { parts: 4 }), comp(m["S6-B11"]!, "hardener", { parts: 1 }), comp(m["S6-B02"]!, "reducer", { parts: 1 })],
  };
}

function groundLayer(m: Codes, code: string, name: string): PlanLayerInput {
  return {
    kind: "ground_coat",
    name,
    coats: 3,
    flashMinutes: 8,
    dryMinutes: 30,
    gunTip: "1.3 mm",
    pressurePsi: 24,
    overlapPct: 75,
    dryFilmPerCoat: 6,
    dryFilmUnit: "um",
    transferEfficiencyPct: 60,
    components: [comp(m[code]!, "basecoat", { parts: 1 }), comp(m["S6-B02"]!, "reducer", { parts: 1 })],
  };
}

function candyLayer(m: Codes, toner: string, coats = 5): PlanLayerInput {
  return {
    kind: "candy",
    name: "Candy",
    coats,
    flashMinutes: 10,
    dryMinutes: 30,
    gunTip: "1.3 mm",
    pressurePsi: 25,
    overlapPct: 75,
    dryFilmPerCoat: 8,
    dryFilmUnit: "um",
    transferEfficiencyPct: 60,
    notes: "Same gun distance and speed every coat; count the coats, the depth depends on them.",
    components: [
      comp(m["S5-B01"]!, "clear", { parts: 6 }),
      comp(m[toner]!, "toner", { parts: 1 }),
      comp(m["S6-B02"]!, "reducer", { percent: 5, percentOf: ["clear", "toner"] }),
    ],
  };
}

function clearLayer(m: Codes, code = "S5-B02", coats = 3): PlanLayerInput {
  return {
    kind: "clear",
    name: code === "S5-B03" ? "Satin clear" : "Clear",
    coats,
    flashMinutes: 12,
    dryMinutes: 720,
    gunTip: "1.3 mm",
    pressurePsi: 27,
    overlapPct: 75,
    dryFilmPerCoat: 1.8,
    dryFilmUnit: "mil",
    transferEfficiencyPct: 65,
    components: [comp(m[code]!, "clear", { parts: 4 }), comp(m["S6-B12"]!, "hardener", { parts: 1 }), comp(m["S6-B02"]!, "reducer", { parts: 1 })],
  };
}

function promoterLayer(m: Codes): PlanLayerInput {
  return {
    kind: "adhesion_promoter",
    name: "Adhesion promoter",
    coats: 1,
    flashMinutes: 10,
    dryMinutes: 15,
    gunTip: "1.2 mm",
    pressurePsi: 22,
    dryFilmPerCoat: 3,
    dryFilmUnit: "um",
    transferEfficiencyPct: 55,
    notes: "Bare plastic only: one wet coat, do not sand after.",
    components: [comp(m["S1-B04"]!, "promoter", { parts: 1 })],
  };
}

function templates(m: Codes): PlanDocumentInput[] {
  return [
    {
      name: "Candy over metallic ground",
      description: "Grey sealer, fine silver ground, five coats of apple-red candy, three coats of 2K clear.",
      layers: [prepLayer(), sealerLayer(m, "S2-B02"), groundLayer(m, "S3-B10", "Metallic ground"), candyLayer(m, "S4-B01"), clearLayer(m)],
    },
    {
      name: "Solid colour, 2K clear",
      description: "Sealer, a solid ground colour, 2K clear. The everyday recipe.",
      layers: [prepLayer(), sealerLayer(m, "S2-B02"), groundLayer(m, "S3-B20", "Solid colour"), clearLayer(m)],
    },
    {
      name: "Candy over white ground, bare plastic",
      description: "Adhesion promoter on bare plastic, white sealer and ground, candy, 2K clear with flex additive.",
      layers: [
        prepLayer(),
        promoterLayer(m),
        sealerLayer(m, "S2-B01"),
        groundLayer(m, "S3-B01", "White ground"),
        candyLayer(m, "S4-B02", 4),
        {
          ...clearLayer(m),
          components: [
            comp(m["S5-B02"]!, "clear", { parts: 4 }),
            comp(m["S6-B12"]!, "hardener", { parts: 1 }),
            comp(m["S6-B02"]!, "reducer", { parts: 1 }),
            comp(m["S7-B01"]!, "flex", { percent: 10, percentOf: ["clear"] }),
          ],
        },
      ],
    },
    {
      name: "Satin clear over a scuffed finish",
      description: "Freshen an existing finish: scuff, clean, two coats of satin clear.",
      layers: [prepLayer(), clearLayer(m, "S5-B03", 2)],
    },
  ];
}

/** Which toner and ground a demo job's finish words ask for. */
function finishOf(title: string) {
  const t = title.toLowerCase();
  const toner = t.includes("cobalt") ? "S4-B02" : t.includes("tangerine") ? "S4-B03" : t.includes("emerald") ? "S4-B04" : t.includes("violet") ? "S4-B05" : t.includes("root beer") ? "S4-B06" : "S4-B01";
  const ground = t.includes("gold") ? "S3-B11" : t.includes("black") ? "S3-B02" : "S3-B10";
  const solidGround = t.includes("black") ? "S3-B02" : t.includes("white") || t.includes("cream") ? "S3-B01" : "S3-B20";
  return { candy: t.includes("candy"), toner, ground, solidGround, flake: t.includes("flake"), satin: t.includes("satin") };
}

/** The template's layers changed for one job's finish words, or null when the template fits as it is. */
function fitLayers(m: Codes, templateIndex: number, finish: ReturnType<typeof finishOf>): PlanLayerInput[] | null {
  const base = templates(m)[templateIndex]!.layers;
  let changed = false;
  const layers = base.map((l) => {
    if (l.kind === "candy" && finish.candy && templateIndex !== 1) {
      if (finish.toner !== (templateIndex === 2 ? "S4-B02" : "S4-B01")) {
        changed = true;
        return candyLayer(m, finish.toner, l.coats as number);
      }
    }
    if (l.kind === "ground_coat") {
      let ground = l;
      if (templateIndex === 0 && finish.ground !== "S3-B10") ground = groundLayer(m, finish.ground, finish.ground === "S3-B02" ? "Black ground" : "Metallic ground");
      if (templateIndex === 1 && finish.solidGround !== "S3-B20") ground = groundLayer(m, finish.solidGround, "Solid colour");
      if (finish.flake) {
        ground = { ...ground, name: `${ground.name} with flake`, components: [...ground.components, comp(m["S7-B05"]!, "flake", { percent: 2, percentOf: ["basecoat"] })] };
      }
      if (ground !== l) changed = true;
      return ground;
    }
    return l;
  });
  return changed ? layers : null;
}

const PLANNED_STAGES: Stage[] = ["booked", "in_prep", "in_booth", "curing", "finishing", "ready", "delivered"];
const SPRAYED_STAGES: Stage[] = ["in_booth", "curing", "finishing", "ready", "delivered"];

export function seedMaterials(ctx: SeedContext) {
  let clock = ctx.now - 240 * DAY;
  const deps = { db: ctx.db, now: () => clock } as unknown as AppDeps;
  const staff = ctx.db.select().from(users).where(inArray(users.id, [ctx.userIds.owner, ctx.userIds.estimator, ctx.userIds.painter, ctx.userIds.painter2])).all();
  const ctxOfUser = (id: string): RequestContext => {
    const u = staff.find((x) => x.id === id)!;
    return { actor: { id: u.id, email: u.email, name: u.name, role: u.role, customerId: null }, address: null };
  };
  const owner = ctxOfUser(ctx.userIds.owner);
  const estimator = ctxOfUser(ctx.userIds.estimator);

  // The catalogue and its lots.
  const m: Codes = {};
  for (const seed of CATALOGUE) {
    const { lots, ...fields } = seed;
    const material = createMaterial(deps, owner, createMaterialInputSchema.parse(fields));
    m[seed.code] = material.id;
    for (const lot of lots) {
      const receivedOn = new Date(ctx.now - lot.receivedDaysAgo * DAY).toISOString().slice(0, 10);
      const expiresOn = lot.expiresInDays == null ? null : new Date(ctx.now + lot.expiresInDays * DAY).toISOString().slice(0, 10);
      // Lots are stocked generously for the demo batches below, then trimmed to the listed quantity at the end.
      createLot(deps, material.id, { lotNumber: lot.lot, quantityOnHand: lot.qty + 40, receivedOn, expiresOn });
    }
  }

  // Templates.
  const tpl = templates(m).map((doc) => createTemplate(deps, estimator, planDocumentSchema.parse(doc)));
  const [candyMetallic, solid, candyPlastic, satin] = tpl as [(typeof tpl)[number], (typeof tpl)[number], (typeof tpl)[number], (typeof tpl)[number]];

  // Plans on the jobs that are booked or further along, and batches on those that reached the booth.
  const jobsInOrder = [...ctx.jobs].sort((a, b) => a.createdAt - b.createdAt);
  for (const job of jobsInOrder) {
    if (!PLANNED_STAGES.includes(job.stage)) continue;
    const substrates = ctx.db.select({ s: jobItems.substrate, unit: jobItems.areaUnit }).from(jobItems).where(eq(jobItems.jobId, job.id)).all();
    const finish = finishOf(job.title);
    const plastic = substrates.some((i) => i.s === "plastic");
    const template = finish.satin ? satin : finish.candy ? (plastic ? candyPlastic : candyMetallic) : solid;
    const boothAt = ctx.db
      .select({ at: jobStageEvents.at })
      .from(jobStageEvents)
      .where(and(eq(jobStageEvents.jobId, job.id), eq(jobStageEvents.toStage, "in_booth")))
      .orderBy(asc(jobStageEvents.at))
      .get()?.at;
    clock = Math.min(job.createdAt + 2 * DAY, (boothAt ?? ctx.now) - 6 * 3_600_000);
    let plan = startJobPlan(deps, estimator, job.id, { fromPlanId: template.id });
    // Fit the copied recipe to the job's own colours: toner and ground, solid colour, flake in the ground.
    const fitted = fitLayers(m, template.id === candyMetallic.id ? 0 : template.id === solid.id ? 1 : template.id === candyPlastic.id ? 2 : 3, finish);
    const finishWords = job.title.split(", ").slice(1).join(", ");
    if (fitted) plan = savePlan(deps, estimator, plan.id, savePlanInputSchema.parse({ name: plan.name, description: `Fitted for this job: ${finishWords}.`, layers: fitted, version: plan.version }));
    if (!SPRAYED_STAGES.includes(job.stage) || !job.painterId) continue;

    // Batches: one per mixed layer, on the day the job went into the booth; the painter records them.
    const painter = ctxOfUser(job.painterId);
    const version = loadPlanVersion(deps, plan.latest.id);
    const areaM2 = jobAreaM2(ctx.db, job.id);
    const usUnits = substrates.some((i) => i.unit === "ft2");
    const mixed = version.layers.filter((l) => l.components.length > 0);
    // A job still in the booth has its clear to come: that batch is left as a draft.
    const stillInBooth = job.stage === "in_booth";
    mixed.forEach((layer, i) => {
      const estimate = estimateLayer(layer, areaM2).volumeMl;
      const ml = Math.max(100, Math.ceil((estimate * 1.15) / 50) * 50);
      clock = Math.min((boothAt ?? ctx.now - DAY) + i * 3 * 3_600_000, ctx.now - 3_600_000);
      const sheet = createMixSheet(deps, painter, {
        jobId: job.id,
        layerId: layer.id,
        mode: "total",
        amount: usUnits ? Math.ceil(ml / 29.5735295625) : ml,
        unit: usUnits ? "floz" : "mL",
        weigh: i % 2 === 1,
        roundingStep: i % 2 === 1 ? 1 : usUnits ? 0.5 : 5,
        roundingUnit: i % 2 === 1 ? "g" : usUnits ? "floz" : "mL",
      });
      if (stillInBooth && i === mixed.length - 1) return;
      clock += 10 * 60_000;
      recordMixSheet(deps, painter, sheet.id, { lines: [], mixedAt: new Date(clock).toISOString() });
    });
  }

  // Trim each lot to the quantity listed above, less what the demo batches used from it.
  clock = ctx.now;
  for (const seed of CATALOGUE) {
    for (const lot of seed.lots) trimLot(ctx, m[seed.code]!, lot.lot, 40);
  }
}

function trimLot(ctx: SeedContext, materialId: number, lotNumber: string, extra: number) {
  ctx.db
    .update(materialLots)
    .set({ quantityOnHand: sql`max(0, ${materialLots.quantityOnHand} - ${extra})` })
    .where(and(eq(materialLots.materialId, materialId), eq(materialLots.lotNumber, lotNumber)))
    .run();
}
