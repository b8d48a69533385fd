export const MATERIAL_CATEGORIES = [
  "cleaner",
  "adhesion_promoter",
  "sealer",
  "ground_coat",
  "toner",
  "intercoat_clear",
  "reducer",
  "hardener",
  "clear",
  "additive",
] as const;
export type MaterialCategory = (typeof MATERIAL_CATEGORIES)[number];

export const MATERIAL_CATEGORY_LABELS: Record<MaterialCategory, string> = {
  cleaner: "Cleaner",
  adhesion_promoter: "Adhesion promoter",
  sealer: "Sealer",
  ground_coat: "Ground coat",
  toner: "Toner / concentrate",
  intercoat_clear: "Intercoat clear",
  reducer: "Reducer",
  hardener: "Hardener",
  clear: "Clear",
  additive: "Additive",
};

/** Units a material is bought and stocked in: volume units of the mix engine, or mass for powders and flake. */
export const PURCHASE_UNITS = ["mL", "L", "floz", "pint", "quart", "gallon", "g", "kg", "oz", "lb"] as const;
export type PurchaseUnit = (typeof PURCHASE_UNITS)[number];

/** What prep or cleaning solvent was used for, when it is logged outside a batch (counted in the VOC log). */
export const SOLVENT_PURPOSES = ["surface_prep", "gun_cleaning", "other"] as const;
export type SolventPurpose = (typeof SOLVENT_PURPOSES)[number];
export const SOLVENT_PURPOSE_LABELS: Record<SolventPurpose, string> = { surface_prep: "Surface prep (cleaning, wipe-down)", gun_cleaning: "Gun and cup cleaning", other: "Other cleaning" };
/** Catalogue categories that can be logged as solvent use: cleaners (wax and grease remover, gun wash) and reducers used to clean. */
export const SOLVENT_CATEGORIES: readonly MaterialCategory[] = ["cleaner", "reducer"];
