import { z } from "zod";
import { SCUFF_MEDIA, type PrepStatus, type PrepStep, type ScuffMedium } from "../domain/prep";
import type { Substrate } from "../domain/substrates";
import { idSchema, madeAtSchema, optionalText, requiredText, versionSchema } from "./common.schema";
import type { UploadDto } from "./upload.schema";

/** Empty input → null; otherwise a number (form inputs send strings). */
export function optionalNumber(label: string, min: number, max: number, int = false) {
  let n = z.coerce.number({ error: `${label} must be a number` }).finite(`${label} must be a number`).min(min, `${label} is at least ${min}`).max(max, `${label} is at most ${max}`);
  if (int) n = n.int(`${label} is a whole number`);
  return z.preprocess((v) => (v === "" || v === undefined ? undefined : v === null ? null : v), n.nullable().optional());
}

export const prepStepsInputSchema = z.object({
  scuffMedium: z
    .preprocess((v) => (v === "" ? null : v), z.enum(SCUFF_MEDIA, { error: `Scuff medium must be one of: ${SCUFF_MEDIA.join(", ")}` }).nullable())
    .optional(),
  /** FEPA P-grade as painters write it ("P320") or the bare number; stored as the number and shown as P320. */
  scuffGrit: z.preprocess((v) => (typeof v === "string" ? v.trim().replace(/^p\s*/i, "") : v), optionalNumber("Grit", 36, 5000, true)),
  cleaner: optionalText(120, "Cleaner"),
  tackCloth: z.boolean({ error: "Tack cloth must be true or false" }).optional(),
  adhesionPromoter: z.boolean({ error: "Adhesion promoter must be true or false" }).optional(),
  adhesionPromoterProduct: optionalText(120, "Adhesion promoter product"),
  notes: optionalText(2000, "Notes"),
});
export type PrepStepsInput = z.input<typeof prepStepsInputSchema>;

export const createPrepRecordInputSchema = prepStepsInputSchema.extend({ itemId: idSchema });
export type CreatePrepRecordInput = z.input<typeof createPrepRecordInputSchema>;

export const updatePrepRecordInputSchema = prepStepsInputSchema.extend({ version: versionSchema });
export type UpdatePrepRecordInput = z.input<typeof updatePrepRecordInputSchema>;

export const reopenPrepRecordInputSchema = z.object({ reason: requiredText(500, "Reason") });
export type ReopenPrepRecordInput = z.input<typeof reopenPrepRecordInputSchema>;

/** A sign-off; `at` is when it was made on the tablet, for one sent late. */
export const signOffPrepRecordInputSchema = z.object({ at: madeAtSchema });
export type SignOffPrepRecordInput = z.input<typeof signOffPrepRecordInputSchema>;

export const listPrepRecordsQuerySchema = z.object({ jobId: idSchema });

export type PrepRecordDto = {
  /** The edit version: goes up with every change; an edit sends the one it read. */
  version: number;
  id: number;
  jobId: number;
  itemId: number;
  itemName: string;
  substrate: Substrate;
  needsAdhesionPromoter: boolean;
  scuffMedium: ScuffMedium | null;
  scuffGrit: number | null;
  cleaner: string | null;
  tackCloth: boolean;
  adhesionPromoter: boolean;
  adhesionPromoterProduct: string | null;
  notes: string | null;
  preparedByName: string | null;
  preparedAt: string;
  signedOffByName: string | null;
  signedOffAt: string | null;
  reopenedNote: string | null;
  status: PrepStatus;
  missingSteps: PrepStep[];
  photos: UploadDto[];
};

/** A job's items, each with its prep record (null until someone starts one). */
export type JobPrepDto = {
  jobId: number;
  allSignedOff: boolean;
  items: { itemId: number; itemName: string; substrate: Substrate; needsAdhesionPromoter: boolean; status: PrepStatus; record: PrepRecordDto | null }[];
};
