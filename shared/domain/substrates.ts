export const SUBSTRATES = [
  "steel",
  "aluminum",
  "fiberglass",
  "plastic",
  "carbon_fiber",
  "wood",
  "existing_finish",
  "other",
] as const;
export type Substrate = (typeof SUBSTRATES)[number];

export const SUBSTRATE_LABELS: Record<Substrate, string> = {
  steel: "Bare steel",
  aluminum: "Aluminum",
  fiberglass: "Fiberglass",
  plastic: "Plastic",
  carbon_fiber: "Carbon fiber",
  wood: "Wood",
  existing_finish: "Existing finish (scuffed)",
  other: "Other",
};

/** Bare plastics usually need an adhesion promoter before sealer (common practice). */
export function needsAdhesionPromoter(substrate: Substrate): boolean {
  return substrate === "plastic";
}

export const AREA_UNITS = ["m2", "ft2"] as const;
export type AreaUnit = (typeof AREA_UNITS)[number];
export const AREA_UNIT_LABELS: Record<AreaUnit, string> = { m2: "m²", ft2: "ft²" };
