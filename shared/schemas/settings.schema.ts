import { z } from "zod";
import { VOLUME_UNIT_IDS } from "../mix/index";
import { AREA_UNITS } from "../domain/substrates";
import { LAYER_KINDS } from "../domain/layers";
import { FILM_UNITS, PRESSURE_UNITS, SCALE_UNITS, UNIT_SYSTEMS } from "../domain/measures";
import { TEMP_UNITS } from "../domain/booth";
import { patchSchemaOf, versionSchema } from "./common.schema";

/** Kinds of quote line a shop may charge sales tax on (which kinds are taxed depends on the state). */
export const TAXABLE_LINE_KINDS = ["labour", "materials", "supplies", "sublet"] as const;

const pct = (label: string, max = 100) =>
  z.coerce.number({ error: `${label} must be a number` }).min(0, `${label} cannot be negative`).max(max, `${label} is limited to ${max}%`);
const cents = (label: string) =>
  z.coerce.number({ error: `${label} must be a number` }).int(`${label} is in whole cents`).min(0, `${label} cannot be negative`).max(100_000_000, `${label} is too large`);

/**
 * A VOC limit the shop enters for its own air district, per coating category (the layer kind the batch was
 * mixed for); nothing is built in, because jurisdictions differ.
 */
export const vocLimitSchema = z.object({
  layerKind: z.enum(LAYER_KINDS, { error: `Coating category must be one of: ${LAYER_KINDS.join(", ")}` }),
  limitGPerL: z.coerce.number({ error: "Limit must be a number" }).positive("Limit must be more than 0").max(2000, "Limit is limited to 2000 g/L"),
});

export const shopSettingsSchema = z.object({
  shopName: z.string().trim().min(1, "Shop name is required").max(120),
  shopAddress: z.string().trim().max(300).default(""),
  shopPhone: z.string().trim().max(40).default(""),
  shopEmail: z.string().trim().max(254).default(""),
  /** Labour rate per hour, integer cents. */
  labourRateCents: cents("Labour rate"),
  taxPercent: pct("Tax"),
  taxAppliesTo: z.array(z.enum(TAXABLE_LINE_KINDS)).default(["materials", "supplies"]),
  depositPercent: pct("Deposit"),
  materialsMarkupPercent: pct("Materials markup", 500),
  shopSuppliesPercent: pct("Shop supplies"),
  quoteValidDays: z.coerce.number().int().min(1, "At least one day").max(365, "At most a year"),
  quoteTerms: z.string().trim().max(4000).default(""),
  /** The unit system the shop works in; each measure below may override it. */
  unitSystem: z.enum(UNIT_SYSTEMS, { error: "Unit system must be metric or us" }),
  defaultVolumeUnit: z.enum(VOLUME_UNIT_IDS),
  defaultAreaUnit: z.enum(AREA_UNITS),
  filmUnit: z.enum(FILM_UNITS, { error: "Film unit must be um or mil" }),
  pressureUnit: z.enum(PRESSURE_UNITS, { error: "Pressure unit must be psi or bar" }),
  tempUnit: z.enum(TEMP_UNITS, { error: "Temperature unit must be C or F" }),
  massUnit: z.enum(SCALE_UNITS, { error: "Scale unit must be g or oz" }),
  /** The shop's colour tolerance for test panels: ΔE00 below `deltaEMatch` is within tolerance, below `deltaEClose` borderline. */
  deltaEMatch: z.coerce.number().positive().max(20),
  deltaEClose: z.coerce.number().positive().max(50),
  vocLimits: z
    .array(vocLimitSchema)
    .max(LAYER_KINDS.length)
    .refine((ls) => new Set(ls.map((l) => l.layerKind)).size === ls.length, "One limit per coating category")
    .default([]),
  /** Paint lost in the cup, gun and overspray beyond the transfer efficiency, per layer kind, added to the estimate (%; kinds not listed: none). */
  wasteAllowances: z
    .array(
      z.object({
        layerKind: z.enum(LAYER_KINDS, { error: `Layer kind must be one of: ${LAYER_KINDS.join(", ")}` }),
        pct: pct("Waste allowance", 200),
      }),
    )
    .max(LAYER_KINDS.length)
    .refine((ls) => new Set(ls.map((l) => l.layerKind)).size === ls.length, "One allowance per layer kind")
    .default([]),
  /** The smallest batch worth mixing (fills the gun cup, measures accurately), mL; an estimated layer needs at least this. */
  minimumBatchMl: z.coerce.number({ error: "Minimum batch must be a number of mL" }).min(0, "Minimum batch cannot be negative").max(20_000, "Minimum batch is limited to 20000 mL").default(0),
  /** Optional VOC mass caps from the shop's air permit, in kg. */
  vocMonthlyCapKg: z.coerce.number().positive().max(1e6).nullable().default(null),
  vocYearlyCapKg: z.coerce.number().positive().max(1e7).nullable().default(null),
  /** Shop rule: the booth takes no colour coat until the customer has approved a test panel in the portal. */
  requireColourSignOff: z.boolean({ error: "Must be true or false" }).default(false),
  /**
   * Rounding a mix to a cup or scale step may move a component's ratio; a move beyond this (in %) is named on
   * the mix sheet and the booth card (2 % by default, common practice for catalysed mixes).
   */
  ratioTolerancePct: z.coerce
    .number({ error: "Ratio tolerance must be a number" })
    .min(0.1, "Ratio tolerance must be at least 0.1%")
    .max(20, "Ratio tolerance is limited to 20%"),
  /** The owner's dashboard warns when the free space left for the data folder falls below this many GB. */
  lowDiskWarningGb: z.coerce
    .number({ error: "Low-disk warning must be a number of GB" })
    .min(0, "Low-disk warning cannot be negative")
    .max(100_000, "Low-disk warning is limited to 100000 GB"),
});
export type ShopSettings = z.infer<typeof shopSettingsSchema>;
/** The settings as the owner edits them: with the edit version a save sends back. */
export type EditableShopSettings = ShopSettings & { version: number };

export const updateShopSettingsSchema = patchSchemaOf(shopSettingsSchema).extend({ version: versionSchema }).refine((s) => s.deltaEMatch === undefined || s.deltaEClose === undefined || s.deltaEMatch <= s.deltaEClose, {
  path: ["deltaEClose"],
  message: "The 'close' threshold must be at least the 'match' threshold",
});
export type UpdateShopSettings = z.input<typeof updateShopSettingsSchema>;

/** What any signed-in user may read: no money. */
export type PublicShopSettings = Pick<ShopSettings, "shopName" | "shopAddress" | "shopPhone" | "shopEmail" | "defaultVolumeUnit" | "defaultAreaUnit" | "deltaEMatch" | "deltaEClose" | "ratioTolerancePct" | "vocLimits" | "unitSystem" | "filmUnit" | "pressureUnit" | "tempUnit" | "massUnit">;

export const DEFAULT_SETTINGS: ShopSettings = {
  shopName: "My custom paint shop",
  shopAddress: "",
  shopPhone: "",
  shopEmail: "",
  labourRateCents: 8500,
  taxPercent: 0,
  taxAppliesTo: ["materials", "supplies"],
  depositPercent: 50,
  materialsMarkupPercent: 25,
  shopSuppliesPercent: 8,
  quoteValidDays: 30,
  quoteTerms: "",
  unitSystem: "metric",
  defaultVolumeUnit: "mL",
  defaultAreaUnit: "m2",
  filmUnit: "um",
  pressureUnit: "bar",
  tempUnit: "C",
  massUnit: "g",
  deltaEMatch: 1,
  deltaEClose: 2,
  vocLimits: [],
  wasteAllowances: [],
  minimumBatchMl: 0,
  vocMonthlyCapKg: null,
  vocYearlyCapKg: null,
  lowDiskWarningGb: 2,
  requireColourSignOff: false,
  ratioTolerancePct: 2,
};
