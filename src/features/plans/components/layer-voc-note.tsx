import { useQuery } from "@tanstack/react-query";
import { TriangleAlert } from "lucide-react";
import type { LayerKind } from "@shared/domain/layers";
import { vocAgainstLimit, vocWarning } from "@shared/domain/voc-limits";
import { mixVoc } from "@shared/mix/index";
import type { MaterialDto } from "@shared/schemas/material.schema";
import { formatNumber } from "@/utils/format-quantity";
import { shopSettingsQueries } from "@/lib/shop-settings.queries";

/**
 * The layer's mixed VOC as it is typed (mix engine mixVoc over the shares), warned against the shop's own limit for
 * the layer's category before anything is mixed. Nothing is shown while a material has no VOC figure.
 */
/** The warning line, also used under the plan's layers and on the mix sheet. */
export function VocOverLimit({ kind, gPerL, limitGPerL }: { kind: LayerKind; gPerL: number; limitGPerL: number }) {
  return (
    <p role="status" data-testid="voc-over-limit" className="mt-2 flex items-start gap-2 rounded-lg border-l-4 border-red-700 bg-red-50 px-3 py-2 text-sm text-red-950">
      <TriangleAlert aria-hidden className="mt-0.5 size-4 shrink-0" />
      {vocWarning(kind, gPerL, limitGPerL)}
    </p>
  );
}

export function LayerVocNote({ kind, parts }: { kind: LayerKind; parts: { share: number; material: MaterialDto | undefined }[] }) {
  const settings = useQuery(shopSettingsQueries.public());
  if (parts.length === 0 || parts.some((p) => p.material?.vocGPerL == null)) return null;
  let gPerL: number;
  try {
    gPerL = mixVoc(parts.map((p) => ({ volume: p.share, vocGPerL: p.material!.vocGPerL!, waterExemptPct: p.material!.waterExemptPct })));
  } catch {
    return null; // all water and exempt: no regulatory VOC to state
  }
  const check = vocAgainstLimit(kind, gPerL, settings.data?.vocLimits ?? []);
  if (check.over && check.limitGPerL != null) return <VocOverLimit kind={kind} gPerL={gPerL} limitGPerL={check.limitGPerL} />;
  return (
    <p className="mt-2 text-sm text-ink-900">
      <span className="font-semibold">Mixed VOC:</span> {formatNumber(gPerL, 0)} g/L
      {check.limitGPerL != null ? ` (shop limit ${formatNumber(check.limitGPerL, 0)} g/L)` : ""}
    </p>
  );
}
