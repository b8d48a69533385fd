import { LAYER_KIND_LABELS, type LayerKind } from "./layers";

/** A VOC limit the shop entered for a coating category (shop settings), g/L less water and exempt. */
export type VocLimit = { layerKind: LayerKind; limitGPerL: number };

export type VocCheck = { limitGPerL: number | null; over: boolean };

/**
 * A layer's mixed VOC against the shop's own limit for its category. Compared unrounded, like the compliance log;
 * no limit entered (or no VOC figure) never warns.
 */
export function vocAgainstLimit(kind: LayerKind, gPerL: number | null, limits: readonly VocLimit[]): VocCheck {
  const limit = limits.find((l) => l.layerKind === kind)?.limitGPerL ?? null;
  return { limitGPerL: limit, over: gPerL != null && limit != null && gPerL > limit };
}

/** The warning shown before mixing: "Mixed VOC 729 g/L is over the shop's limit of 630 g/L for candy." */
export function vocWarning(kind: LayerKind, gPerL: number, limitGPerL: number): string {
  return `Mixed VOC ${Math.round(gPerL)} g/L is over the shop's limit of ${Math.round(limitGPerL)} g/L for ${LAYER_KIND_LABELS[kind].toLowerCase()}. Check the mix (a compliant reducer or less of it) before mixing, and your air district's rules.`;
}
