import { z } from "zod";
import type { ColourVerdict } from "../domain/colour-verdict";
import { idSchema, isoDateSchema, optionalText, requiredText, versionSchema } from "./common.schema";
import { pageQuerySchema } from "../api/pagination";
import { optionalNumber } from "./prep.schema";
import type { UploadDto } from "./upload.schema";
import { checkSetup, spraySetupFields, type SpraySetupDto } from "./spray-setup.schema";
import { ILLUMINANTS, PANEL_LIGHTS, type Illuminant, type PanelLight } from "../domain/spray-setup";
import { TEMP_UNITS, type TempUnit } from "../domain/booth";
import { checkTemp } from "./booth-conditions.schema";

export const MAX_PANEL_COATS = 30;
export const MAX_COMPARE = 6;

const parts = (label: string) =>
  z.coerce.number({ error: `${label} must be a number` }).finite(`${label} must be a number`).positive(`${label} must be more than 0`).max(100, `${label} is at most 100`);

/** A reading under another light than the main (daylight) one, with the illuminant the meter was set to. */
export const panelReadingSchema = z.object({
  light: z.enum(PANEL_LIGHTS, { error: `Light must be one of: ${PANEL_LIGHTS.join(", ")}` }),
  illuminant: z.enum(ILLUMINANTS, { error: `Illuminant must be one of: ${ILLUMINANTS.join(", ")}` }),
  labL: z.coerce.number({ error: "L* must be a number" }).finite().min(0, "L* is at least 0").max(100, "L* is at most 100"),
  labA: z.coerce.number({ error: "a* must be a number" }).finite().min(-160, "a* is at least -160").max(160, "a* is at most 160"),
  labB: z.coerce.number({ error: "b* must be a number" }).finite().min(-160, "b* is at least -160").max(160, "b* is at most 160"),
});

const readingsSchema = z
  .array(panelReadingSchema, { error: "readings must be a list" })
  .max(PANEL_LIGHTS.length, `At most ${PANEL_LIGHTS.length} readings`)
  .refine((r) => new Set(r.map((x) => x.light)).size === r.length, "One reading per light");

/** An optional reference; an empty pick ("") from a form means none. */
const optionalId = z.preprocess((v) => (v === "" ? null : v), idSchema.nullable()).optional();

const panelFields = {
  /** The ground coat: picked from the catalogue (groundMaterialId), or named when it is not in it. */
  groundName: z.preprocess((v) => (v === "" ? undefined : v), requiredText(120, "Ground coat").optional()),
  groundMaterialId: optionalId,
  candyName: requiredText(120, "Candy"),
  candyMaterialId: optionalId,
  /** Let-down ratio, clear : toner (e.g. 6 : 1). */
  letDownClear: parts("Clear parts"),
  letDownToner: parts("Toner parts"),
  coats: z.coerce
    .number({ error: "Coats must be a number" })
    .int("Coats is a whole number")
    .min(1, "At least one coat")
    .max(MAX_PANEL_COATS, `At most ${MAX_PANEL_COATS} coats`),
  jobId: optionalId,
  planLayerId: optionalId,
  mixSheetId: optionalId,
  /** Optional colour-meter reading, CIELAB (D65 as the meter reports it). */
  labL: optionalNumber("L*", 0, 100),
  labA: optionalNumber("a*", -160, 160),
  labB: optionalNumber("b*", -160, 160),
  sprayedOn: z.preprocess((v) => (v === "" ? null : v), isoDateSchema.nullable()).optional(),
  notes: optionalText(2000, "Notes"),
  /** Readings under the booth light and warm indoor light (the main reading above is daylight, D65). */
  readings: readingsSchema.optional(),
  ...spraySetupFields,
  boothTemp: optionalNumber("Booth temperature", -10, 140),
  tempUnit: z.preprocess((v) => (v === "" ? null : v), z.enum(TEMP_UNITS, { error: "Temperature unit must be C or F" }).nullable()).optional(),
  humidityPct: optionalNumber("Humidity", 0, 100),
};

/** The ground is picked from the catalogue or named (checked with the other fields where zod can). */
const groundGiven = (v: { groundName?: string; groundMaterialId?: number | null }) => !!v.groundName || v.groundMaterialId != null;
const groundGivenParams = {
  path: ["groundMaterialId"],
  message: "Pick the ground coat from the catalogue, or name it",
  when: (payload: { value: unknown }) => typeof payload.value === "object" && payload.value !== null,
};

function labAllOrNone(v: { labL?: number | null; labA?: number | null; labB?: number | null }, ctx: z.RefinementCtx) {
  const given = [v.labL, v.labA, v.labB].filter((x) => x !== null && x !== undefined).length;
  if (given !== 0 && given !== 3) {
    for (const k of ["labL", "labA", "labB"] as const)
      if (v[k] === null || v[k] === undefined) ctx.addIssue({ code: "custom", path: [k], message: "Enter L*, a* and b* together, or none" });
  }
}

export const createPanelInputSchema = z
  .object(panelFields)
  .superRefine(labAllOrNone)
  .refine(groundGiven, groundGivenParams)
  .superRefine(checkSetup)
  .superRefine((v, ctx) => checkTemp({ boothTemp: v.boothTemp, tempUnit: v.tempUnit ?? undefined }, ctx));
export type CreatePanelInput = z.input<typeof createPanelInputSchema>;

export const updatePanelInputSchema = z
  .object(panelFields)
  .partial()
  .extend({ version: versionSchema })
  .superRefine(labAllOrNone)
  .superRefine(checkSetup)
  .superRefine((v, ctx) => checkTemp({ boothTemp: v.boothTemp, tempUnit: v.tempUnit ?? undefined }, ctx));
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
  /** The edit version: goes up with every change; an edit sends the one it read. */
  version: number;
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
  /** The main reading, under daylight (D65). */
  lab: Lab | null;
  /** Readings under the other lights. */
  readings: { light: PanelLight; illuminant: Illuminant; lab: Lab }[];
  /** How it was sprayed, and the booth then. */
  setup: SpraySetupDto;
  conditions: { boothTemp: number | null; tempUnit: TempUnit | null; humidityPct: number | null };
  /** The plan layer and the batch it was sprayed from, with the lots poured (staff only). */
  planLayer: { id: number; name: string; planName: string; version: number } | null;
  mixSheet: {
    id: number;
    status: "draft" | "mixed" | "void";
    mixedAt: string | null;
    lots: { materialCode: string; materialName: string; lotNumber: string | null }[];
    /** The toner's share of the whole ready-to-spray batch (with reducer), in %; null when the batch has no toner. */
    tonerReadyPct: number | null;
  } | null;
  sprayedOn: string | null;
  notes: string | null;
  createdById: string | null;
  createdByName: string | null;
  createdAt: string;
  /** The first photo (any light), and every photo with the light it was taken under. */
  photo: UploadDto | null;
  photos: UploadDto[];
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
