/** Kinds of layer in a finish plan, bottom to top. */
export const LAYER_KINDS = ["prep", "adhesion_promoter", "sealer", "ground_coat", "candy", "effect_mid_coat", "intercoat_clear", "clear"] as const;
export type LayerKind = (typeof LAYER_KINDS)[number];

export const LAYER_KIND_LABELS: Record<LayerKind, string> = {
  prep: "Prep",
  adhesion_promoter: "Adhesion promoter",
  sealer: "Sealer",
  ground_coat: "Ground coat",
  candy: "Candy",
  effect_mid_coat: "Effect mid-coat",
  intercoat_clear: "Intercoat clear",
  clear: "Clear",
};
