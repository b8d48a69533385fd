import { LAYER_KIND_LABELS, type LayerKind } from "../domain/layers";

export type FinishLayerWords = { name: string; kind: LayerKind | string; coats: number };

const coatWord = (coats: number) => `${Number(coats.toFixed(2))} ${coats === 1 ? "coat" : "coats"}`;

/**
 * The finish in plain words for a customer: each layer's name and coats, bottom to top.
 * "Sealer, 2 coats · Silver ground coat, 2 coats · Candy red, 5 coats · 2K clear, 3 coats".
 * Prep layers (no paint film) are described without coats.
 */
export function describeFinish(layers: readonly FinishLayerWords[]): string {
  return layers
    .map((l) => {
      const name = l.name.trim() || LAYER_KIND_LABELS[l.kind as LayerKind] || "Layer";
      if (l.kind === "prep" || !(l.coats > 0)) return name;
      return `${name}, ${coatWord(l.coats)}`;
    })
    .join(" · ");
}
