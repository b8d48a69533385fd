import { z } from "zod";
import { LAYER_KINDS, type LayerKind } from "../domain/layers";
import type { MaterialCategory, PurchaseUnit } from "../domain/materials";
import type { Caution } from "../domain/safety";
import { idSchema, optionalText, requiredText, versionSchema } from "./common.schema";
import { optionalNumber, requiredNumber } from "./material.schema";

export const MAX_PLAN_LAYERS = 20;
export const MAX_LAYER_COMPONENTS = 12;

const label = z
  .string({ error: "Label is required" })
  .trim()
  .min(1, "Label is required")
  .max(40, "Label is limited to 40 characters");

/**
 * One component of a layer's mix, as the editor sends it: a catalogue material with either parts
 * (4:1:1) or a percent of other components of the same layer, named by their labels.
 * An empty parts/percent field counts as not given, so the mix engine can say what is missing.
 */
export const layerComponentInputSchema = z.object({
  materialId: idSchema,
  label,
  parts: optionalNumber("Parts", { min: 0, max: 1000, gt: true }),
  percent: optionalNumber("Percent", { min: 0, max: 1000, gt: true }),
  percentOf: z.array(label).max(MAX_LAYER_COMPONENTS, "Too many names").nullable().optional(),
});
export type LayerComponentInput = z.input<typeof layerComponentInputSchema>;

export const layerKindSchema = z.enum(LAYER_KINDS, { error: `Kind must be one of: ${LAYER_KINDS.join(", ")}` });

export const planLayerInputSchema = z.object({
  kind: layerKindSchema,
  name: requiredText(80, "Layer name"),
  coats: requiredNumber("Coats", { min: 0, max: 30, gt: true }),
  flashMinutes: requiredNumber("Flash time", { min: 0, max: 1440 }),
  minutesPerCoat: requiredNumber("Minutes per coat", { min: 0, max: 240, gt: true }).optional(),
  dryMinutes: requiredNumber("Dry time", { min: 0, max: 20_160 }),
  /** Empty: taken from the materials' data sheets when the plan is saved. */
  inductionMinutes: optionalNumber("Induction time", { min: 0, max: 1440 }),
  recoatMinMinutes: optionalNumber("Earliest recoat", { min: 0, max: 20_160 }),
  recoatMaxMinutes: optionalNumber("Latest recoat", { min: 0, max: 100_800, gt: true }),
  gunTip: optionalText(20, "Gun tip"),
  pressurePsi: optionalNumber("Air pressure", { min: 0, max: 150 }),
  overlapPct: optionalNumber("Overlap", { min: 0, max: 100 }),
  dryFilmPerCoat: optionalNumber("Dry film per coat", { min: 0, max: 500, gt: true }),
  dryFilmUnit: z.enum(["um", "mil"], { error: "Film unit must be um or mil" }).optional(),
  transferEfficiencyPct: requiredNumber("Transfer efficiency", { min: 0, max: 100, gt: true }).optional(),
  notes: optionalText(2000, "Notes"),
  components: z.array(layerComponentInputSchema).max(MAX_LAYER_COMPONENTS, `At most ${MAX_LAYER_COMPONENTS} components`),
});
export type PlanLayerInput = z.input<typeof planLayerInputSchema>;

/** The whole plan as the editor sends it; the server saves it as the latest version or a new one. */
export const planDocumentSchema = z.object({
  name: requiredText(120, "Plan name"),
  description: optionalText(2000, "Description"),
  /** A note for this version ("more candy on the tank"). */
  versionNote: optionalText(300, "Version note"),
  layers: z.array(planLayerInputSchema).max(MAX_PLAN_LAYERS, `At most ${MAX_PLAN_LAYERS} layers`),
});
export type PlanDocumentInput = z.input<typeof planDocumentSchema>;
/** A save from the editor: the document and the plan's `version` it was opened at. */
export const savePlanInputSchema = planDocumentSchema.extend({ version: versionSchema });
export type SavePlanInput = z.output<typeof savePlanInputSchema>;
export type PlanDocument = z.output<typeof planDocumentSchema>;

export const listPlansQuerySchema = z.object({
  kind: z.enum(["template", "job"], { error: "kind must be template or job" }).default("template"),
  q: z.string().trim().max(120, "Search text is too long").optional(),
});
export type ListPlansQuery = z.infer<typeof listPlansQuerySchema>;

/** Start a job's plan: from a template or another plan (fromPlanId), from another job's current plan (fromJobId), or empty. */
export const startJobPlanInputSchema = z
  .object({
    fromPlanId: idSchema.optional(),
    fromJobId: idSchema.optional(),
    name: optionalText(120, "Plan name"),
  })
  .refine((v) => !(v.fromPlanId && v.fromJobId), { path: ["fromJobId"], message: "Choose a template or a job, not both" });
export type StartJobPlanInput = z.input<typeof startJobPlanInputSchema>;
export type StartJobPlanValues = z.output<typeof startJobPlanInputSchema>;

export const versionParamsSchema = z.object({ id: idSchema, versionId: idSchema });

export type LayerComponentDto = {
  id: number;
  position: number;
  label: string;
  parts: number | null;
  percent: number | null;
  percentOf: string[] | null;
  materialId: number;
  materialCode: string;
  materialName: string;
  category: MaterialCategory;
  purchaseUnit: PurchaseUnit;
  densityGPerMl: number | null;
  vocGPerL: number | null;
  waterExemptPct: number;
  volumeSolidsPct: number | null;
  potLifeMinutes: number | null;
  containsIsocyanates: boolean;
  flammable: boolean;
  /** Office only: cost of one purchase unit of the material, integer cents. */
  costCents?: number;
};

export type PlanLayerDto = {
  id: number;
  position: number;
  kind: LayerKind;
  name: string;
  coats: number;
  flashMinutes: number;
  minutesPerCoat: number;
  dryMinutes: number;
  /** How long a mixed batch stands before spraying, minutes. */
  inductionMinutes: number | null;
  /** The window for the next layer over this one, minutes after its last coat (null: no limit). */
  recoatMinMinutes: number | null;
  recoatMaxMinutes: number | null;
  /** The mix has a hardener (2K): coats need a batch recorded as mixed. */
  catalysed: boolean;
  gunTip: string | null;
  pressurePsi: number | null;
  overlapPct: number | null;
  dryFilmPerCoat: number | null;
  dryFilmUnit: "um" | "mil";
  transferEfficiencyPct: number;
  notes: string | null;
  components: LayerComponentDto[];
  cautions: Caution[];
  /** Shortest pot life of the layer's materials, minutes (null when none is catalysed). */
  potLifeMinutes: number | null;
};

export type PlanVersionDto = {
  id: number;
  planId: number;
  version: number;
  frozenAt: string | null;
  /** Used at the booth (frozen) or referenced by a mix sheet: a save makes a new version. */
  locked: boolean;
  note: string | null;
  createdAt: string;
  createdByName: string | null;
  layers: PlanLayerDto[];
};

export type PlanVersionSummaryDto = {
  id: number;
  version: number;
  frozenAt: string | null;
  locked: boolean;
  note: string | null;
  createdAt: string;
  createdByName: string | null;
  layerCount: number;
  /** This version is the one the job was sprayed with. */
  sprayed: boolean;
};

export type PlanSummaryDto = {
  id: number;
  name: string;
  description: string | null;
  isTemplate: boolean;
  jobId: number | null;
  jobTitle: string | null;
  latestVersion: number;
  layerCount: number;
  layerKinds: LayerKind[];
  updatedAt: string;
};

export type PlanDto = {
  id: number;
  name: string;
  description: string | null;
  isTemplate: boolean;
  jobId: number | null;
  jobTitle: string | null;
  copiedFromPlanId: number | null;
  copiedFromName: string | null;
  sprayedVersionId: number | null;
  createdAt: string;
  updatedAt: string;
  versionCount: number;
  latest: PlanVersionDto;
  /** The edit version of the plan (goes up with every save; a save sends the one it read). Not `latest.version`. */
  version: number;
};

export type LayerEstimateDto = {
  layerId: number;
  name: string;
  kind: LayerKind;
  /** Ready-to-spray volume for all the job's items with the shop's waste allowance, at least the minimum batch, mL (0 when it cannot be worked out: see `problem`). */
  volumeMl: number;
  /** The film build's theoretical minimum, before the waste allowance, mL. */
  theoreticalMl: number;
  /** The shop's waste allowance for this layer kind, %. */
  wasteAllowancePct: number;
  /** Office only: material cost of that volume, integer cents. */
  costCents?: number;
  /** VOC of the mixed layer, g/L less water and exempt (null when a material has no VOC figure). */
  vocGPerL: number | null;
  /** The shop's VOC limit for the layer's category (null: none entered), and whether the mixed layer is over it. */
  vocLimitGPerL: number | null;
  vocOverLimit: boolean;
  /** Volume solids of the mixed layer, %. */
  volumeSolidsPct: number | null;
  /** One coat's dry and wet film (in the layer's film unit), and the coverage of the mixed layer at its transfer efficiency. */
  film: { dryFilmPerCoat: number; wetFilmPerCoat: number; unit: "um" | "mil"; transferEfficiencyPct: number; m2PerL: number; ft2PerGal: number } | null;
  cautions: Caution[];
  problem: string | null;
};

export type PlanEstimateDto = {
  planId: number;
  versionId: number;
  totalAreaM2: number;
  layers: LayerEstimateDto[];
  totalVolumeMl: number;
  /** Office only. */
  totalCostCents?: number;
  problems: string[];
};

export type JobPlanDto = { plan: PlanDto | null; estimate: PlanEstimateDto | null };

export const copyAsTemplateInputSchema = z.object({ name: optionalText(120, "Template name") });
export type CopyAsTemplateInput = z.input<typeof copyAsTemplateInputSchema>;
