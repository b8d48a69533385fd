import { CHANGE_WAITING } from "@shared/domain/change-orders";
import { useShopUnits } from "@/lib/shop-settings.queries";
import { formatPressure } from "@/utils/format-measure";
import { MixWordsList } from "@/components/ui/mix-words-list";
import { Check, ShieldAlert } from "lucide-react";
import { Link } from "react-router";
import { LAYER_KIND_LABELS } from "@shared/domain/layers";
import type { BoothLayerDto } from "@shared/schemas/booth.schema";
import { cn } from "@/utils/cn";
import { formatMinutes } from "@shared/domain/duration";


/** The plan's layers in spray order: done, the current one, and what comes after. */
export function LayerList({ layers, prepPath }: { layers: BoothLayerDto[]; prepPath: string }) {
  const units = useShopUnits();
  return (
    <ol className="flex flex-col gap-3" aria-label="Layers in order">
      {layers.map((layer, i) => {
        const coats = Math.max(1, Math.ceil(layer.coats - 1e-9));
        return (
          <li
            key={layer.id}
            aria-current={layer.status === "current" ? "step" : undefined}
            className={cn(
              "rounded-xl border-2 bg-white px-4 py-3",
              layer.status === "current" ? "border-candy-600 shadow-raised" : layer.status === "done" ? "border-primer-200 bg-primer-50" : "border-primer-300",
            )}
          >
            <div className="flex items-start gap-3">
              <span
                aria-hidden
                className={cn(
                  "grid size-10 shrink-0 place-items-center rounded-full text-lg font-bold",
                  layer.status === "done" ? "bg-emerald-700 text-white" : layer.status === "current" ? "bg-candy-600 text-white" : "bg-primer-200 text-ink-950",
                )}
              >
                {layer.status === "done" ? <Check className="size-6" /> : i + 1}
              </span>
              <div className="min-w-0 flex-1">
                <h3 className="text-lg font-semibold text-ink-950">
                  {layer.name}
                  <span className="sr-only">
                    {" "}
                    ({layer.status === "done" ? "done" : layer.status === "current" ? "current layer" : "to come"})
                  </span>
                </h3>
                <p className="text-sm font-medium text-primer-800">
                  {LAYER_KIND_LABELS[layer.kind]}
                  {layer.isPrep ? " · done through the prep records" : ` · ${layer.coatsDone} of ${coats} ${coats === 1 ? "coat" : "coats"}`}
                </p>
                {!layer.isPrep ? (
                  <p className="mt-1 text-sm text-ink-900">
                    Flash {formatMinutes(layer.flashMinutes)} · dry {formatMinutes(layer.dryMinutes)}
                    {layer.gunTip ? ` · tip ${layer.gunTip}` : ""}
                    {layer.pressurePsi != null ? ` · ${formatPressure(layer.pressurePsi, units.pressure)}` : ""}
                  </p>
                ) : (
                  <Link to={prepPath} className="mt-1 inline-flex min-h-11 items-center text-sm font-semibold text-candy-700 underline underline-offset-2">
                    Prep records
                  </Link>
                )}
                {layer.changeWaiting ? <p className="mt-1 inline-block rounded-md bg-amber-100 px-2 py-1 text-sm font-semibold text-amber-950 ring-1 ring-amber-400">{CHANGE_WAITING}</p> : null}
                <MixWordsList components={layer.components} className="mt-1 text-primer-800" />
                {layer.cautions.length ? (
                  <p className="mt-1 flex items-center gap-1.5 text-sm font-semibold text-flake-800">
                    <ShieldAlert aria-hidden className="size-4" />
                    {layer.cautions.filter((c) => c.id !== "defer").map((c) => c.title).join(" · ")}
                  </p>
                ) : null}
                {layer.notes ? <p className="mt-1 text-sm text-ink-900 italic">{layer.notes}</p> : null}
              </div>
              {!layer.isPrep ? (
                <div className="flex shrink-0 gap-1" aria-hidden>
                  {Array.from({ length: coats }, (_, k) => (
                    <span key={k} className={cn("size-3 rounded-full", k < layer.coatsDone ? "bg-emerald-700" : "border-2 border-primer-400")} />
                  ))}
                </div>
              ) : null}
            </div>
          </li>
        );
      })}
    </ol>
  );
}
