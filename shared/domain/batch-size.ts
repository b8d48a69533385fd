import { LAYER_KIND_LABELS, type LayerKind } from "./layers";

/**
 * How much paint a layer needs in the cup, and whether a batch is enough. Pure, for the estimate, the mix sheet and
 * the booth alike.
 */

export type WasteAllowance = { layerKind: LayerKind; pct: number };

/** The shop's waste allowance for a layer kind, % (0 when the shop set none for it). */
export const wasteAllowanceFor = (kind: LayerKind, allowances: readonly WasteAllowance[]) => allowances.find((a) => a.layerKind === kind)?.pct ?? 0;

/** The theoretical volume plus the waste allowance, at least the minimum batch; 0 stays 0 (nothing to spray). */
export function withWasteAllowance(theoreticalMl: number, wastePct: number, minimumBatchMl: number): number {
  if (theoreticalMl <= 0) return 0;
  return Math.max(minimumBatchMl, theoreticalMl * (1 + wastePct / 100));
}

/** A candy's colour depends on its toner share: the whole layer comes from one batch so every part matches. */
export const ONE_BATCH_KINDS: readonly LayerKind[] = ["candy"];

/**
 * A warning when a batch is smaller than its layer needs (needMl from the estimate, with the waste allowance).
 * For a candy the batch must cover every part on its own; for other layers the batches mixed before it count too.
 */
export function batchShortfall(kind: LayerKind, needMl: number | null, batchMl: number, earlierMl: number): { shortMl: number; message: string } | null {
  if (needMl == null || needMl <= 0) return null;
  const oneBatch = ONE_BATCH_KINDS.includes(kind);
  const have = oneBatch ? batchMl : batchMl + earlierMl;
  if (have >= needMl - 1e-6) return null;
  const shortMl = needMl - have;
  const r = (ml: number) => `${Math.round(ml)} mL`;
  if (oneBatch)
    return {
      shortMl,
      message: `This ${LAYER_KIND_LABELS[kind].toLowerCase()} batch is ${r(batchMl)}; the layer needs ${r(needMl)} for every part. Mix it all at once: one batch for all parts, so the colour matches from part to part.`,
    };
  return { shortMl, message: `${earlierMl > 0 ? `With the batches mixed before it, this makes ${r(have)}` : `This batch is ${r(have)}`}; the layer needs about ${r(needMl)}. Mix ${r(shortMl)} more.` };
}
