import { Link } from "react-router";
import type { BoothDto } from "@shared/schemas/booth.schema";
import { ButtonLink } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { formatNumber, formatVolume } from "@/utils/format-quantity";
import { isVolumeUnit } from "@shared/mix/index";
import { formatClock } from "./booth-timers";

/** The batch for the current layer: its amounts as mixed, lots, and a link to the full mix sheet. */
export function BatchPanel({ card, mixSheetPath, jobPlanPath }: { card: BoothDto; mixSheetPath: (id: number) => string; jobPlanPath: string }) {
  const layerId = card.next.state === "spray" ? card.next.layerId : null;
  const sheets = card.mixSheets.filter((s) => s.layerId === layerId);
  const sheet = sheets.find((s) => s.id === card.openBatch?.mixSheetId) ?? sheets[0];
  const layer = card.layers.find((l) => l.id === layerId);
  return (
    <Panel title="Mix sheet" titleId="batch-heading">
      {!layer ? (
        <p className="text-primer-800">No layer to mix for.</p>
      ) : !sheet ? (
        <div className="flex flex-col items-start gap-3">
          <p className="text-base text-ink-950">No mix sheet for {layer.name} yet.</p>
          {layer.components.length ? (
            <ButtonLink to={jobPlanPath} variant="secondary" size="lg">
              Open the job&apos;s plan to mix a batch
            </ButtonLink>
          ) : null}
        </div>
      ) : (
        <div className="flex flex-col gap-3">
          <p className="text-base font-semibold text-ink-950">
            {sheet.status === "mixed" && sheet.mixedAt ? `Mixed at ${formatClock(sheet.mixedAt)}${sheet.mixedByName ? ` by ${sheet.mixedByName}` : ""}` : "Not mixed yet (draft)"}
          </p>
          <table className="w-full text-left text-base">
            <caption className="sr-only">Components of the batch for {layer.name}</caption>
            <thead>
              <tr className="border-b border-primer-300 text-sm text-primer-800">
                <th scope="col" className="py-2 font-semibold">Component</th>
                <th scope="col" className="py-2 text-right font-semibold">Planned</th>
                <th scope="col" className="py-2 text-right font-semibold">Lot</th>
              </tr>
            </thead>
            <tbody>
              {sheet.lines.map((l) => (
                <tr key={l.label} className="border-b border-primer-200 last:border-0">
                  <th scope="row" className="py-2 text-ink-950">
                    <span className="block font-semibold">
                      <span className="font-mono">{l.materialCode}</span> {l.materialName}
                    </span>
                    <span className="block text-sm font-normal text-primer-800">
                      {l.label}
                      {l.readyPct != null ? ` · ${formatNumber(l.readyPct, 1)} % of the ready-to-spray mix` : ""}
                    </span>
                  </th>
                  <td className="py-2 text-right tabular-nums">{isVolumeUnit(sheet.unit) ? formatVolume(l.plannedMl, sheet.unit) : `${l.plannedInUnit} ${sheet.unit}`}</td>
                  <td className="py-2 text-right">{l.lotNumber ?? "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <Link to={mixSheetPath(sheet.id)} className="inline-flex min-h-12 items-center text-base font-semibold text-candy-700 underline underline-offset-2">
            Open mix sheet #{sheet.id}
          </Link>
        </div>
      )}
    </Panel>
  );
}
