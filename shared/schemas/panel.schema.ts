import { z } from "zod";
import type { ColourVerdict } from "../domain/colour-verdict";
import { idSchema, isoDateSchema, optionalText, requiredText } from "./common.schema";
import { pageQuerySchema } from "../api/pagination";
import { optionalNumber } from "./prep.schema";
import type { UploadDto } from "./upload.schema";

export const MAX_PANEL_COATS = 30;
export const MAX_COMPARE = 6;

const parts = (label: string) =>
  z.coerce.number({ error: `${label} must be a number` }).finite(`${label} must be a number`).positive(`${label} must be more than 0`).max(100, `${label} is at most 100`);

const panelFields = {
  groundName: requiredText(120, "Ground coat"),
  groundMaterialId: idSchema.nullable().optional(),
  candyName: requiredText(120, "Candy"),
  candyMaterialId: idSchema.nullable().optional(),
  /** Let-down ratio, clear : toner (e.g. 6 : 1). */
  letDownClear: parts("Clear parts"),
  letDownToner: parts("Toner parts"),
  coats: z.coerce
    .number({ error: "Coats must be a number" })
    .int("Coats is a whole number")
    .min(1, "At least one coat")
    .max(MAX_PANEL_COATS, `At most ${MAX_PANEL_COATS} coats`),
  jobId: idSchema.nullable().optional(),
  planLayerId: idSchema.nullable().optional(),
  mixSheetId: idSchema.nullable().optional(),
  /** Optional colour-meter reading, CIELAB (D65 as the meter reports it). */
  labL: optionalNumber("L*", 0, 100),
  labA: optionalNumber("a*", -160, 160),
  labB: optionalNumber("b*", -160, 160),
  sprayedOn: z.preprocess((v) => (v === "" ? null : v), isoDateSchema.nullable()).optional(),
  notes: optionalText(2000, "Notes"),
};

function labAllOrNone(v: { labL?: number | null; labA?: number | null; labB?: number | null }, ctx: z.RefinementCtx) {
  const given = [v.labL, v.labA, v.labB].filter((x) => x !== null && x !== undefined).length;
  if (given !== 0 && given !== 3) {
    for (const k of ["labL", "labA", "labB"] as const)
      if (v[k] === null || v[k] === undefined) ctx.addIssue({ code: "custom", path: [k], message: "Enter L*, a* and b* together, or none" });
  }
}

export const createPanelInputSchema = z.object(panelFields).superRefine(labAllOrNone);
export type CreatePanelInput = z.input<typeof createPanelInputSchema>;

export const updatePanelInputSchema = z.object(panelFields).partial().superRefine(labAllOrNone);
export type UpdatePanelInput = z.input<typeof updatePanelInputSchema>;

export const listPanelsQuerySchema = pageQuerySchema.extend({
  ground: z.string().trim().max(120).optional(),
  candy: z.string().trim().max(120).optional(),
  coats: z.coerce.number({ error: "coats must be a number" }).int("coats is a whole number").min(1).max(MAX_PANEL_COATS).optional(),
  jobId: idSchema.optional(),
});
export type ListPanelsQuery = z.infer<typeof listPanelsQuerySchema>;

/** ?ids=3,7,9 */
export const comparePanelsQuerySchema = z.object({
  ids: z
    .union([z.string(), z.array(z.string())])
    .transform((v) => (Array.isArray(v) ? v : v.split(",")).map((s) => s.trim()).filter(Boolean).map(Number))
    .pipe(z.array(z.number().int("Panel ids are whole numbers").positive("Panel ids are positive")).min(2, "Pick at least two panels").max(MAX_COMPARE, `Compare at most ${MAX_COMPARE} panels`)),
});

export const ladderQuerySchema = z
  .object({
    ground: requiredText(120, "Ground coat"),
    candy: requiredText(120, "Candy"),
    /** The let-down to express every rung in (defaults to the first rung's). */
    toClear: parts("Clear parts").optional(),
    toToner: parts("Toner parts").optional(),
  })
  .refine((q) => (q.toClear === undefined) === (q.toToner === undefined), { path: ["toToner"], message: "Give both parts of the ratio" });
export type LadderQuery = z.input<typeof ladderQuerySchema>;

export const setApprovedPanelInputSchema = z.object({ panelId: idSchema.nullable() });
export type SetApprovedPanelInput = z.input<typeof setApprovedPanelInputSchema>;

export type Lab = { L: number; a: number; b: number };

export type ColourComparisonDto = {
  againstPanelId: number;
  deltaE: number;
  verdict: ColourVerdict;
  text: string;
};

export type PanelDto = {
  id: number;
  /** e.g. "Candy Garnet over Fine Silver, 6:1, 4 coats" */
  label: string;
  groundName: string;
  groundMaterialId: number | null;
  candyName: string;
  candyMaterialId: number | null;
  letDownClear: number;
  letDownToner: number;
  /** Toner's share of the let-down, toner / (clear + toner). */
  tonerFraction: number;
  coats: number;
  jobId: number | null;
  jobTitle: string | null;
  planLayerId: number | null;
  mixSheetId: number | null;
  lab: Lab | null;
  sprayedOn: string | null;
  notes: string | null;
  createdById: string | null;
  createdByName: string | null;
  createdAt: string;
  photo: UploadDto | null;
  /** For a panel made for a job that has an approved panel (and both have readings). */
  vsApproved: ColourComparisonDto | null;
  isApprovedForJob: boolean;
};

export type PanelListDto = {
  items: PanelDto[];
  total: number;
  page: number;
  pageSize: number;
  facets: { grounds: string[]; candies: string[]; coats: number[] };
};

export type PanelCompareDto = {
  panels: PanelDto[];
  /** ΔE00 for every pair that has readings, with the shop's verdict. */
  pairs: { a: number; b: number; deltaE: number; verdict: ColourVerdict }[];
  thresholds: { deltaEMatch: number; deltaEClose: number };
};

export type PanelLadderDto = {
  groundName: string;
  candyName: string;
  reference: { clear: number; toner: number; tonerFraction: number };
  rungs: {
    panel: PanelDto;
    /** Toner fraction × coats: what the colour depth follows (Beer–Lambert, same wet film per coat). */
    depth: number;
    /** Coats at the reference let-down that give this rung's depth (mix engine equivalentCoats). */
    equivalentCoats: number;
    deltaEFromPrevious: number | null;
  }[];
};

export type JobColourDto = {
  jobId: number;
  approvedPanel: PanelDto | null;
  panels: PanelDto[];
  thresholds: { deltaEMatch: number; deltaEClose: number };
};
