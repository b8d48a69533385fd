import { z } from "zod";
import type { LayerKind } from "../domain/layers";
import type { MaterialCategory, PurchaseUnit } from "../domain/materials";
import type { Caution } from "../domain/safety";
import type { MassUnit, MeasuringUnit, VolumeUnit } from "../mix/index";
import { idSchema, requiredText } from "./common.schema";
import { optionalNumber, requiredNumber } from "./material.schema";
import { measuringUnitSchema, volumeUnitSchema } from "./mix.schema";

export const MIX_SHEET_STATUSES = ["draft", "mixed", "void"] as const;
export type MixSheetStatus = (typeof MIX_SHEET_STATUSES)[number];
export const MIX_SHEET_STATUS_LABELS: Record<MixSheetStatus, string> = { draft: "Not mixed yet", mixed: "Mixed", void: "Voided" };

/**
 * A batch for one layer of a job's current plan: make `amount` of ready-to-spray mix ("total"), or scale from
 * `amount` of the component labelled `knownLabel` on hand ("component"). With `weigh`, the sheet gives
 * scale readings; `roundingStep` (in `roundingUnit`) rounds amounts to what the cup or scale shows.
 */
export const createMixSheetInputSchema = z
  .object({
    jobId: idSchema,
    layerId: idSchema,
    mode: z.enum(["total", "component"], { error: "Choose a batch size or a component on hand" }),
    amount: requiredNumber("Amount", { min: 0, max: 100_000, gt: true }),
    unit: volumeUnitSchema,
    knownLabel: z.string().trim().max(40).optional().nullable(),
    weigh: z.boolean({ error: "Must be true or false" }).default(false),
    roundingStep: optionalNumber("Rounding step", { min: 0, max: 1000, gt: true }),
    roundingUnit: measuringUnitSchema.optional().nullable(),
  })
  .refine((v) => v.mode !== "component" || !!v.knownLabel, { path: ["knownLabel"], message: "Choose the component you have on hand" });
export type CreateMixSheetInput = z.input<typeof createMixSheetInputSchema>;

export const recordMixSheetInputSchema = z.object({
  /** When it was mixed (defaults to now); not in the future. */
  mixedAt: z.iso.datetime({ error: "Use an ISO date and time", offset: true }).optional(),
  /** Unit of the `actual` amounts below (defaults to the sheet's unit). A mass unit needs each material's density. */
  actualUnit: measuringUnitSchema.optional(),
  lines: z
    .array(
      z.object({
        lineId: idSchema,
        /** The lot poured from; null when the material is not taken from a tracked lot. */
        lotId: idSchema.nullable().optional(),
        /** What was really poured; omitted = the planned amount. */
        actual: optionalNumber("Amount used", { min: 0, max: 100_000 }),
      }),
    )
    .max(24),
});
export type RecordMixSheetInput = z.input<typeof recordMixSheetInputSchema>;

export const voidMixSheetInputSchema = z.object({ reason: requiredText(300, "Reason") });
export type VoidMixSheetInput = z.input<typeof voidMixSheetInputSchema>;

export const listMixSheetsQuerySchema = z.object({
  jobId: idSchema.optional(),
  status: z.enum(MIX_SHEET_STATUSES, { error: "status must be draft, mixed or void" }).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type ListMixSheetsQuery = z.infer<typeof listMixSheetsQuerySchema>;

export type LotChoiceDto = { id: number; lotNumber: string; quantityOnHand: number; purchaseUnit: PurchaseUnit; expiresOn: string | null; expired: boolean };

export type MixSheetLineDto = {
  id: number;
  position: number;
  label: string;
  materialId: number;
  materialCode: string;
  materialName: string;
  category: MaterialCategory;
  purchaseUnit: PurchaseUnit;
  /** Planned amount in the sheet's unit, and in mL. */
  amount: number;
  plannedMl: number;
  /** Fraction of the ready-to-spray batch. */
  share: number;
  /** The amount as the plan gives it, saying what a percent is of: "1 part", "10 % of S5-B01 Intercoat clear". */
  asPlanned: string | null;
  /** Weight on a scale (when the material has a density). */
  grams: number | null;
  /** Weighed sheets: what to pour of this component after taring, in `scaleUnit` (a whole scale step)… */
  scaleTarget: number | null;
  /** …and what the scale reads with it in, poured into one cup without taring (the sum of the targets so far). */
  scaleReads: number | null;
  /** Rounded amount for the cup or scale, in the rounding unit. */
  rounded: number | null;
  /** How far rounding moves this component's ratio to `ratioReference`, in %. */
  ratioErrorPct: number | null;
  /** Labels this component's ratio is measured against (the base part, or what its percent is of). */
  ratioReference: string[] | null;
  actualMl: number | null;
  lotId: number | null;
  lotNumber: string | null;
  /** Draft: the oldest unexpired lot with stock (the one to use first). */
  suggestedLotId: number | null;
  lots: LotChoiceDto[];
  densityGPerMl: number | null;
  vocGPerL: number | null;
  /** Office only, recorded sheets: cost of what was used, integer cents. */
  costCents?: number | null;
};

export type MixSheetDto = {
  id: number;
  jobId: number;
  jobTitle: string;
  planId: number;
  planName: string;
  planVersionId: number;
  planVersion: number;
  /** The sheet was made from an older version than the plan's latest. */
  planChanged: boolean;
  /** The customer approved a change order that moved the job to a later plan version: this sheet is of an older one. */
  superseded: boolean;
  layerId: number;
  layerName: string;
  layerKind: LayerKind;
  status: MixSheetStatus;
  mode: "total" | "component";
  amount: number;
  unit: VolumeUnit;
  knownLabel: string | null;
  weigh: boolean;
  roundingStep: number | null;
  roundingUnit: MeasuringUnit | null;
  worstRatioErrorPct: number | null;
  worstComponent: string | null;
  /** Components whose ratio moved beyond the shop's tolerance when rounded, worst first. */
  movedComponents: string[];
  /** Weighed sheets: the scale's unit and step, and Σ targets (the last scale reading). */
  scaleUnit: MassUnit | null;
  scaleStep: number | null;
  scaleLastReading: number | null;
  ratioTolerancePct: number;
  roundedTotal: number | null;
  total: number;
  totalMl: number;
  vocGPerL: number | null;
  /** The shop's VOC limit for the layer's category (null: none entered), and whether this batch is over it. */
  vocLimitGPerL: number | null;
  vocOverLimit: boolean;
  /** What the layer needs for the whole job (estimate with the waste allowance), mL; null when it cannot be worked out. */
  needMl: number | null;
  /** This batch is smaller than the layer needs (a candy: mix it all at once, one batch for all parts). */
  batchWarning: string | null;
  potLifeMinutes: number | null;
  potLifeEndsAt: string | null;
  mixedAt: string | null;
  mixedByName: string | null;
  voidedAt: string | null;
  voidedByName: string | null;
  voidReason: string | null;
  createdAt: string;
  createdByName: string | null;
  cautions: Caution[];
  lines: MixSheetLineDto[];
  /** Office only, recorded sheets. */
  totalCostCents?: number | null;
};

export type MixSheetSummaryDto = {
  id: number;
  jobId: number;
  jobTitle: string;
  layerId: number;
  layerName: string;
  layerKind: LayerKind;
  status: MixSheetStatus;
  total: number;
  unit: VolumeUnit;
  totalMl: number;
  vocGPerL: number | null;
  mixedAt: string | null;
  mixedByName: string | null;
  potLifeEndsAt: string | null;
  createdAt: string;
};


