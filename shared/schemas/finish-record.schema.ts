import { z } from "zod";
import { idSchema, isoDateSchema, optionalText } from "./common.schema";
import type { LayerKind } from "../domain/layers";
import type { TempUnit } from "../domain/temperature";
import type { Stage } from "../domain/stages";
import type { Substrate } from "../domain/substrates";
import type { Caution } from "../domain/safety";
import type { Lab } from "./panel.schema";
import type { SpraySetupDto } from "./spray-setup.schema";
import type { UploadDto } from "./upload.schema";

/**
 * What was really sprayed on a job, layer by layer: the document a shop files so a finish can be repaired or
 * repeated years later. No money anywhere; the customer's version also leaves out internal notes and override reasons.
 */
export type FinishRecordDto = {
  job: { id: number; title: string; customerName: string; stage: Stage; items: { name: string; substrate: Substrate; surfaceArea: number; areaUnit: string }[] };
  plan: { name: string; version: number; frozenAt: string | null } | null;
  approvedPanel: { id: number; label: string; lab: Lab | null; setupSummary: string } | null;
  painters: string[];
  prep: { itemName: string; substrate: Substrate; steps: string[]; signedOffByName: string | null; signedOffAt: string | null; photos: UploadDto[] }[];
  layers: FinishLayerDto[];
  /** True when built for the customer's portal. */
  customerView: boolean;
  generatedAt: string;
};

export type FinishLayerDto = {
  id: number;
  position: number;
  kind: LayerKind;
  name: string;
  plannedCoats: number;
  flashMinutes: number;
  dryMinutes: number;
  /** The mix as the plan gave it. */
  components: { label: string; materialCode: string; materialName: string; parts: number | null; percent: number | null; percentOf: string[] | null }[];
  /** Every material that went in, with the lots poured. */
  materials: { code: string; name: string; lots: string[] }[];
  batches: {
    id: number;
    mixedAt: string | null;
    mixedByName: string | null;
    totalMl: number;
    unit: string;
    vocGPerL: number | null;
    lines: { label: string; materialCode: string; materialName: string; plannedMl: number; pouredMl: number | null; lotNumber: string | null }[];
  }[];
  /** The coats that count, as they stand after corrections. */
  coats: FinishCoatDto[];
  cautions: Caution[];
};

export type FinishCoatDto = {
  coatNumber: number;
  /** When the coat was sprayed, and when the entry reached the shop's record. */
  at: string;
  loggedAt: string;
  painterName: string | null;
  boothTemp: number | null;
  tempUnit: TempUnit | null;
  humidityPct: number | null;
  setup: SpraySetupDto;
  note: string | null;
  /** Rules the painter went past, with the reason given (staff only). */
  overrides: { rule: "prep" | "timing" | "change"; reason: string }[];
  correctionReason: string | null;
  photos: UploadDto[];
};

/** Start a new job from a recorded finish: the same recipe, for this customer (the source's when left out). */
export const repeatFinishInputSchema = z.object({
  customerId: idSchema.optional(),
  title: optionalText(160, "Title"),
  dueDate: z.preprocess((v) => (v === "" ? null : v), isoDateSchema.nullable()).optional(),
});
export type RepeatFinishInput = z.input<typeof repeatFinishInputSchema>;

export type RepeatFinishDto = {
  /** The new job and its plan. */
  id: number;
  planId: number;
  /** Lots the record used that are no longer in stock: a new lot of a toner or ground can differ, so spray a panel. */
  usedUpLots: { materialCode: string; materialName: string; lotNumber: string }[];
};
