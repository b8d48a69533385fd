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
