import { useState } from "react";
import { ArrowLeft, ArrowRight, Check, Scale } from "lucide-react";
import type { MixSheetDto } from "@shared/schemas/mix-sheet.schema";
import { Button } from "@/components/ui/button";
import { cn } from "@/utils/cn";
import { unitSymbol } from "@/utils/format-quantity";

/**
 * Weighing at the bench, one component at a time: tare the cup, pour to the target the scale should show,
 * then the next. Large figures, readable at arm's length with gloves on; one step is open at a time.
 */
/** A scale figure with as many decimals as the scale's step shows: 0.1 g → "200.0 g", so the display matches. */
function scaleFigure(value: number, unit: string, step: number): string {
  const decimals = Math.min(4, Math.max(0, Math.ceil(-Math.log10(step) - 1e-9)));
  return `${new Intl.NumberFormat(undefined, { minimumFractionDigits: decimals, maximumFractionDigits: decimals }).format(value)} ${unitSymbol(unit)}`;
}

export function WeighSteps({ sheet }: { sheet: MixSheetDto }) {
  const [current, setCurrent] = useState(0);
  if (!sheet.weigh || sheet.scaleUnit == null || sheet.lines.some((l) => l.scaleTarget == null)) return null;
  const unit = sheet.scaleUnit;
  const fig = (v: number) => scaleFigure(v, unit, sheet.scaleStep ?? 0.1);
  const lines = sheet.lines;
  const done = current >= lines.length;
  return (
    <section aria-labelledby="weigh-heading" className="print-hidden rounded-xl border border-primer-200 bg-white p-4 shadow-card">
      <h2 id="weigh-heading" className="flex items-center gap-2 text-lg font-semibold">
        <Scale aria-hidden className="size-5" /> Weigh it, one component at a time
      </h2>
      <p className="mt-1 text-sm text-primer-700">
        Each target is what the scale shows after you tare it. Scale step {fig(sheet.scaleStep!)}; the batch is{" "}
        {fig(sheet.scaleLastReading!)}.
      </p>
      <ol className="mt-4 flex flex-col gap-3">
        {lines.map((l, i) => {
          const state = i < current ? "poured" : i === current ? "now" : "later";
          return (
            <li
              key={l.id}
              aria-current={state === "now" ? "step" : undefined}
              className={cn(
                "grid grid-cols-[auto_1fr] items-center gap-x-4 gap-y-1 rounded-xl border-2 p-3 sm:grid-cols-[auto_1fr_auto]",
                state === "now" ? "border-ink-950 bg-primer-50" : "border-primer-200",
                state === "poured" && "opacity-70",
              )}
            >
              <span className={cn("row-span-2 flex size-10 items-center justify-center rounded-full text-lg font-bold", state === "poured" ? "bg-emerald-700 text-white" : "bg-primer-200 text-ink-950")}>
                {state === "poured" ? <Check aria-label="Poured" className="size-5" /> : i + 1}
              </span>
              <span className="text-base">
                <span className="font-semibold">Tare, then pour {l.label}</span>{" "}
                <span className="text-primer-700">
                  <span className="font-mono">{l.materialCode}</span> {l.materialName}
                </span>
              </span>
              <span className="col-start-2 text-sm text-primer-700 sm:col-start-2">In one cup without taring, the scale would read {fig(l.scaleReads!)}.</span>
              <span
                className={cn("col-span-2 text-right font-bold tabular-nums sm:col-span-1 sm:col-start-3 sm:row-span-2 sm:row-start-1", state === "now" ? "text-5xl" : "text-3xl")}
                data-testid={`weigh-target-${l.label}`}
              >
                {fig(l.scaleTarget!)}
              </span>
            </li>
          );
        })}
      </ol>
      <div className="mt-4 flex flex-wrap items-center gap-3">
        <Button size="lg" variant="secondary" disabled={current === 0} onClick={() => setCurrent((c) => c - 1)} icon={<ArrowLeft aria-hidden className="size-5" />}>
          Back
        </Button>
        {done ? (
          <p role="status" className="text-lg font-semibold">
            All {lines.length} poured: {fig(sheet.scaleLastReading!)} in the cup. Stir before use.
          </p>
        ) : (
          <Button size="lg" onClick={() => setCurrent((c) => c + 1)} icon={<ArrowRight aria-hidden className="size-5" />}>
            Poured {lines[current]!.label}: next
          </Button>
        )}
      </div>
    </section>
  );
}
