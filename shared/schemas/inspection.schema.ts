import { z } from "zod";
import { fromDigits, idSchema, optionalText } from "./common.schema";
import { optionalNumber } from "./prep.schema";
import { AREA_UNITS, type AreaUnit, type Substrate } from "../domain/substrates";
import {
  EXISTING_FINISHES,
  FINDING_LEVELS,
  SOLVENT_TEST_RESULTS,
  type ExistingFinish,
  type Finding,
  type FindingLevel,
  type PrepReason,
  type SolventTestResult,
} from "../domain/intake";
import type { QuoteLine } from "../quote/index";
import type { UploadDto } from "./upload.schema";
import type { PortalPhotoDto } from "./quote.schema";

export const MAX_INSPECTED_ITEMS = 50;

const level = (label: string) =>
  z.preprocess((v) => (v === "" || v == null ? "none" : v), z.enum(FINDING_LEVELS, { error: `${label} must be one of: ${FINDING_LEVELS.join(", ")}` }));

/** One item's inspection. `note` is the shop's own; the customer never sees it. */
export const inspectionItemInputSchema = z.object({
  itemId: idSchema,
  existingFinish: z.enum(EXISTING_FINISHES, { error: `Existing finish must be one of: ${EXISTING_FINISHES.join(", ")}` }),
  dents: level("Dents"),
  cracks: level("Cracks"),
  pinholes: level("Pinholes"),
  stressCracks: level("Stress cracks"),
  rust: level("Rust"),
  earlierRepairs: level("Earlier repairs"),
  hardwareToRemove: optionalText(300, "Hardware to remove"),
  /** The area as measured at intake (defaults to the item's own area when left empty). */
  measuredArea: optionalNumber("Measured area", 0.001, 10_000),
  areaUnit: z.preprocess((v) => (v === "" ? undefined : v), z.enum(AREA_UNITS, { error: "Area unit must be m2 or ft2" }).optional()),
  solventTest: z.enum(SOLVENT_TEST_RESULTS, { error: `Solvent test must be one of: ${SOLVENT_TEST_RESULTS.join(", ")}` }),
  note: optionalText(1000, "Note"),
});
export type InspectionItemInput = z.input<typeof inspectionItemInputSchema>;

/** An inspection's version: 0 while none is saved (the first save creates it), then as for every edited record. */
const inspectionVersionSchema = z.preprocess(
  fromDigits,
  z.number({ error: "Send the version of the inspection you are changing (version; 0 for a new one)" }).int("Version is a whole number").min(0, "Version is 0 or more"),
);

/** PUT /api/jobs/:id/inspection. Items not listed keep what they had. */
export const saveInspectionInputSchema = z
  .object({
    version: inspectionVersionSchema,
    /** Words the customer reads beside the quote. */
    customerSummary: optionalText(2000, "Summary for the customer"),
    /** The shop's own notes (never shown to the customer). */
    notes: optionalText(2000, "Notes"),
    items: z.array(inspectionItemInputSchema, { error: "items must be a list" }).max(MAX_INSPECTED_ITEMS, `At most ${MAX_INSPECTED_ITEMS} items`),
  })
  .refine((v) => new Set(v.items.map((i) => i.itemId)).size === v.items.length, { path: ["items"], message: "Each item once" });
export type SaveInspectionInput = z.input<typeof saveInspectionInputSchema>;

/**
 * POST /api/jobs/:id/inspection/prep-line: the quote (and its edit version) the suggested line goes on; without a
 * quote, a job that has none gets a new draft quote with the line on it.
 */
export const addPrepLineInputSchema = z
  .object({
    quoteId: idSchema.optional(),
    editVersion: z.preprocess(fromDigits, z.number({ error: "Send the quote's editVersion" }).int("editVersion is a whole number").positive("editVersion is positive")).optional(),
  })
  .refine((v) => v.quoteId === undefined || v.editVersion !== undefined, { path: ["editVersion"], message: "Send the quote's editVersion with the quote" });
export type AddPrepLineInput = z.input<typeof addPrepLineInputSchema>;

export type InspectionItemDto = {
  itemId: number;
  itemName: string;
  substrate: Substrate;
  /** The item's own area, from the job. */
  surfaceArea: number;
  areaUnit: AreaUnit;
  /** Null until this item is inspected. */
  inspection: {
    id: number;
    existingFinish: ExistingFinish;
    solventTest: SolventTestResult;
    hardwareToRemove: string | null;
    measuredArea: number | null;
    measuredAreaUnit: AreaUnit | null;
    note: string | null;
    photos: UploadDto[];
  } & Record<Finding, FindingLevel> | null;
  suggestion: { hours: number; reasons: PrepReason[] } | null;
};

export type InspectionDto = {
  jobId: number;
  /** 0 while none is saved. */
  version: number;
  exists: boolean;
  customerSummary: string | null;
  notes: string | null;
  inspectedByName: string | null;
  inspectedAt: string | null;
  items: InspectionItemDto[];
  /** The prep the inspection suggests: hours, and the quote line priced at the shop's labour rate. */
  suggestion: { hours: number; line: QuoteLine; amountCents: number } | null;
  /** The job's latest quote, for "add the suggested prep line". */
  quote: { id: number; editVersion: number; version: number; status: string; hasPrepLine: boolean } | null;
};

/** What the customer reads beside the quote: findings in words and shared photos; no shop notes, no hours. */
export type PortalInspectionDto = {
  inspectedAt: string;
  summary: string | null;
  items: {
    name: string;
    existingFinish: string;
    solventTest: string | null;
    findings: string[];
    measuredArea: number | null;
    areaUnit: AreaUnit | null;
    photos: PortalPhotoDto[];
  }[];
};
