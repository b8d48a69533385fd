import { z } from "zod";
import { MATERIAL_CATEGORIES, PURCHASE_UNITS, type MaterialCategory, type PurchaseUnit } from "../domain/materials";
import type { Caution } from "../domain/safety";
import { idSchema, isoDateSchema, optionalText, requiredText, versionSchema } from "./common.schema";
import { parseMoneyToCents } from "../quote/money";

/**
 * A number field that may be left empty: "" / null / undefined → null, numeric strings are read as numbers
 * (form inputs send strings), anything else fails with a message naming the field.
 */
export function optionalNumber(label: string, { min, max, int = false, gt = false }: { min: number; max: number; int?: boolean; gt?: boolean }) {
  let n = z.number({ error: `${label} must be a number` });
  n = gt ? n.gt(min, `${label} must be more than ${min}`) : n.min(min, `${label} cannot be below ${min}`);
  n = n.max(max, `${label} is limited to ${max}`);
  if (int) n = n.int(`${label} must be a whole number`);
  return z
    .preprocess((v) => (v === "" || v === undefined || v === null ? null : typeof v === "string" ? Number(v.trim()) : v), n.nullable())
    .optional();
}

/** A required number field; numeric strings from form inputs are read as numbers. */
export function requiredNumber(label: string, { min, max, int = false, gt = false }: { min: number; max: number; int?: boolean; gt?: boolean }) {
  let n = z.number({ error: `${label} must be a number` });
  n = gt ? n.gt(min, `${label} must be more than ${min}`) : n.min(min, `${label} cannot be below ${min}`);
  n = n.max(max, `${label} is limited to ${max}`);
  if (int) n = n.int(`${label} must be a whole number`);
  return z.preprocess((v) => (v === "" || v === null || v === undefined ? undefined : typeof v === "string" ? Number(v.trim()) : v), n);
}

/** A checkbox value: true/false, or "true"/"false"/"1"/"0" from a query string. */
export const flagSchema = z.preprocess(
  (v) => (v === "true" || v === "1" || v === "on" ? true : v === "false" || v === "0" || v === "" ? false : v),
  z.boolean({ error: "Must be true or false" }),
);

export const MAX_MATERIAL_COST_CENTS = 10_000_000;

export const materialCategorySchema = z.enum(MATERIAL_CATEGORIES, { error: `Category must be one of: ${MATERIAL_CATEGORIES.join(", ")}` });
export const purchaseUnitSchema = z.enum(PURCHASE_UNITS, { error: `Unit must be one of: ${PURCHASE_UNITS.join(", ")}` });

/** The shop's own code: letters, digits and dashes, e.g. "S5-B02". */
export const materialCodeSchema = z
  .string({ error: "Code is required" })
  .trim()
  .toUpperCase()
  .min(1, "Code is required")
  .max(24, "Code is limited to 24 characters")
  .regex(/^[A-Z0-9][A-Z0-9.\-/]*$/, "Use letters, digits, dots, slashes and dashes");

export const materialFieldsSchema = z.object({
  code: materialCodeSchema,
  name: requiredText(120, "Name"),
  category: materialCategorySchema,
  purchaseUnit: purchaseUnitSchema,
  /** Cost of one purchase unit, integer cents. */
  costCents: requiredNumber("Cost", { min: 0, max: MAX_MATERIAL_COST_CENTS, int: true }),
  volumeSolidsPct: optionalNumber("Volume solids", { min: 0, max: 100 }),
  vocGPerL: optionalNumber("VOC", { min: 0, max: 2000 }),
  waterExemptPct: optionalNumber("Water and exempt", { min: 0, max: 100 }),
  densityGPerMl: optionalNumber("Density", { min: 0, max: 5, gt: true }),
  potLifeMinutes: optionalNumber("Pot life", { min: 0, max: 10_080, int: true, gt: true }),
  /** Data-sheet timing, minutes: induction before spraying, and the window for the next layer over this one. */
  inductionMinutes: optionalNumber("Induction time", { min: 0, max: 1440, int: true }),
  recoatMinMinutes: optionalNumber("Earliest recoat", { min: 0, max: 20_160, int: true }),
  recoatMaxMinutes: optionalNumber("Latest recoat", { min: 0, max: 100_800, int: true, gt: true }),
  containsIsocyanates: z.boolean({ error: "Must be true or false" }).optional(),
  flammable: z.boolean({ error: "Must be true or false" }).optional(),
  lowStockThreshold: optionalNumber("Low-stock level", { min: 0, max: 100_000 }),
  notes: optionalText(2000, "Notes"),
  active: z.boolean({ error: "Must be true or false" }).optional(),
});

export const createMaterialInputSchema = materialFieldsSchema;
export type CreateMaterialInput = z.input<typeof createMaterialInputSchema>;
export type CreateMaterialValues = z.output<typeof createMaterialInputSchema>;

export const updateMaterialInputSchema = materialFieldsSchema.partial().extend({ version: versionSchema });
export type UpdateMaterialInput = z.input<typeof updateMaterialInputSchema>;

export const listMaterialsQuerySchema = z.object({
  category: materialCategorySchema.optional(),
  q: z.string().trim().max(120, "Search text is too long").optional(),
  /** Include retired materials (default: only active ones). */
  includeInactive: flagSchema.optional(),
});
export type ListMaterialsQuery = z.infer<typeof listMaterialsQuerySchema>;

export const lotFieldsSchema = z.object({
  lotNumber: requiredText(60, "Lot number"),
  quantityOnHand: requiredNumber("Quantity", { min: 0, max: 100_000 }),
  receivedOn: isoDateSchema.nullable().optional().or(z.literal("").transform(() => null)),
  expiresOn: isoDateSchema.nullable().optional().or(z.literal("").transform(() => null)),
});
export const createLotInputSchema = lotFieldsSchema;
export type CreateLotInput = z.input<typeof createLotInputSchema>;
export const updateLotInputSchema = lotFieldsSchema.partial().extend({ version: versionSchema });
export type UpdateLotInput = z.input<typeof updateLotInputSchema>;

export const lotParamsSchema = z.object({ id: idSchema, lotId: idSchema });
export const fileParamsSchema = z.object({ id: idSchema, fileId: idSchema });

export const MATERIAL_FILE_KINDS = ["tds", "sds"] as const;
export type MaterialFileKind = (typeof MATERIAL_FILE_KINDS)[number];
export const MATERIAL_FILE_KIND_LABELS: Record<MaterialFileKind, string> = {
  tds: "Technical data sheet",
  sds: "Safety data sheet",
};
/** The form fields sent beside the file in a data-sheet upload (multipart). */
export const uploadMaterialFileInputSchema = z.object({
  kind: z.enum(MATERIAL_FILE_KINDS, { error: "Say whether this is the technical (tds) or safety (sds) data sheet" }),
});

export type LotDto = {
  version: number;
  id: number;
  materialId: number;
  lotNumber: string;
  /** In the material's purchase unit. */
  quantityOnHand: number;
  receivedOn: string | null;
  expiresOn: string | null;
  expired: boolean;
  createdAt: string;
};

export type MaterialFileDto = {
  id: number;
  kind: MaterialFileKind;
  mime: string;
  size: number;
  originalName: string;
  createdAt: string;
  uploadedByName: string | null;
};

/** A material as every staff member may see it: no money. */
export type MaterialStaffDto = {
  id: number;
  /** The edit version: goes up with every change; an edit sends the one it read. */
  version: number;
  code: string;
  name: string;
  category: MaterialCategory;
  purchaseUnit: PurchaseUnit;
  volumeSolidsPct: number | null;
  vocGPerL: number | null;
  waterExemptPct: number;
  densityGPerMl: number | null;
  potLifeMinutes: number | null;
  inductionMinutes: number | null;
  recoatMinMinutes: number | null;
  recoatMaxMinutes: number | null;
  containsIsocyanates: boolean;
  flammable: boolean;
  lowStockThreshold: number | null;
  notes: string | null;
  active: boolean;
  /** Sum of the lots on hand, in the purchase unit. */
  stockOnHand: number;
  lowStock: boolean;
  cautions: Caution[];
  createdAt: string;
  updatedAt: string;
};

/** The office's view adds the cost of one purchase unit. */
export type MaterialDto = MaterialStaffDto & { costCents?: number };

export type MaterialDetailDto = MaterialDto & { lots: LotDto[]; files: MaterialFileDto[] };

/**
 * The material form: as the API's fields, with the cost typed as money ("54.00") and read into cents exactly
 * (shared/quote/money.ts parseMoneyToCents). The form sends `{ ...rest, costCents: cost }`.
 */
export const materialFormSchema = materialFieldsSchema.omit({ costCents: true }).extend({
  cost: z.string({ error: "Cost is required" }).transform((v, ctx) => {
    const cents = parseMoneyToCents(v);
    if (cents === null || cents < 0 || cents > MAX_MATERIAL_COST_CENTS) {
      ctx.addIssue({ code: "custom", message: "Enter the cost of one unit, like 54.00" });
      return z.NEVER;
    }
    return cents;
  }),
});
export type MaterialFormInput = z.input<typeof materialFormSchema>;
export type MaterialFormValues = z.output<typeof materialFormSchema>;
