import type { ReactNode } from "react";
import { cn } from "@/utils/cn";
import { Link } from "react-router";
import { LAYER_KIND_LABELS } from "@shared/domain/layers";
import { formatCents } from "@shared/quote/money";
import { VocOverLimit } from "./layer-voc-note";
import type { LayerEstimateDto, PlanEstimateDto, PlanLayerDto } from "@shared/schemas/plan.schema";
import type { VolumeUnit } from "@shared/mix/index";
import { mixSentence } from "@shared/domain/mix-words";
import { formatMinutes } from "@shared/domain/duration";
import { MixWordsList } from "@/components/ui/mix-words-list";
import { SafetyCautions } from "@/components/ui/safety-cautions";
import { paths } from "@/config/paths";
import { formatNumber, formatVolume } from "@/utils/format-quantity";

/** The mix in one line, each component named by material, each percent saying what it is of. */
export function mixWords(layer: Pick<PlanLayerDto, "components">): string {
  return mixSentence(layer.components);
}

/** Volume units of the US system: coverage is then shown per gallon in ft², else per litre in m². */
const US_UNITS = new Set<VolumeUnit>(["floz", "cup", "pint", "quart", "gallon"]);
const film = (l: PlanLayerDto) => (l.dryFilmPerCoat == null ? null : `${formatNumber(l.dryFilmPerCoat, 2)} ${l.dryFilmUnit === "mil" ? "mil" : "µm"}`);

/**
 * A plan's layers, bottom to top, each with its mix, coats and timings, gun set-up, the materials, and the
 * safety cautions. With an estimate, each layer also shows its volume, VOC and (office) cost.
 */
export function PlanLayersView({
  layers,
  estimate,
  unit = "mL",
  layerActions,
}: {
  layers: PlanLayerDto[];
  estimate?: PlanEstimateDto | null;
  unit?: VolumeUnit;
  layerActions?: (layer: PlanLayerDto) => ReactNode;
}) {
  if (layers.length === 0) return <p className="rounded-lg border border-dashed border-primer-300 bg-white p-4 text-primer-700">This plan has no layers yet.</p>;
  const byLayer = new Map<number, LayerEstimateDto>((estimate?.layers ?? []).map((e) => [e.layerId, e]));
  return (
    <ol className="flex flex-col gap-3" aria-label="Layers, bottom to top">
      {layers.map((l) => {
        const e = byLayer.get(l.id);
        return (
          <li key={l.id} className="rounded-xl border border-primer-200 bg-white shadow-card">
            <div className="flex flex-wrap items-start justify-between gap-3 border-b border-primer-100 px-4 py-3">
              <div className="min-w-0">
                <h3 className="text-base font-semibold text-ink-950">
                  <span className="mr-2 text-primer-600 tabular-nums">{l.position}.</span>
                  {l.name}
                  <span className="ml-2 rounded-full bg-ink-50 px-2 py-0.5 align-middle text-xs font-semibold text-ink-800">{LAYER_KIND_LABELS[l.kind]}</span>
                </h3>
                <MixWordsList components={l.components} className="mt-0.5 text-ink-900" />
              </div>
              {layerActions ? <div className="flex flex-wrap gap-2">{layerActions(l)}</div> : null}
            </div>
            <div className="grid gap-4 px-4 py-3 2xl:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
              <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-sm sm:grid-cols-4">
                {l.kind === "prep" ? (
                  <Fact label="Prep">Scuff, clean and sign off each item</Fact>
                ) : (
                  <>
                    <Fact label="Coats">{formatNumber(l.coats, 2)}</Fact>
                    <Fact label="Flash">{formatMinutes(l.flashMinutes)}</Fact>
                  </>
                )}
                <Fact label="Dry before next">{formatMinutes(l.dryMinutes)}</Fact>
                {l.inductionMinutes ? <Fact label="Induction">{formatMinutes(l.inductionMinutes)}</Fact> : null}
                {l.recoatMinMinutes != null || l.recoatMaxMinutes != null ? (
                  <Fact label="Recoat window">
                    {formatMinutes(l.recoatMinMinutes ?? 0)} to {l.recoatMaxMinutes != null ? formatMinutes(l.recoatMaxMinutes) : "any time"}
                  </Fact>
                ) : null}
                {l.kind !== "prep" && l.gunTip ? <Fact label="Gun tip">{l.gunTip}</Fact> : null}
                {l.kind !== "prep" && l.pressurePsi != null ? <Fact label="Pressure">{formatNumber(l.pressurePsi, 1)} psi</Fact> : null}
                {l.kind !== "prep" && l.overlapPct != null ? <Fact label="Overlap">{formatNumber(l.overlapPct, 0)} %</Fact> : null}
                {film(l) ? <Fact label="Dry film / coat">{film(l)}</Fact> : null}
                {e?.film ? (
                  <Fact label="Wet film / coat">
                    {formatNumber(e.film.wetFilmPerCoat, 2)} {e.film.unit === "mil" ? "mil" : "µm"}
                  </Fact>
                ) : null}
                {e?.film ? (
                  <Fact label={`Coverage at ${formatNumber(e.film.transferEfficiencyPct, 0)} % transfer`}>
                    {US_UNITS.has(unit) ? `${formatNumber(e.film.ft2PerGal, 0)} ft²/gal` : `${formatNumber(e.film.m2PerL, 1)} m²/L`}
                  </Fact>
                ) : null}
                {l.potLifeMinutes ? <Fact label="Pot life">{formatMinutes(l.potLifeMinutes)}</Fact> : null}
                {e && e.volumeMl > 0 ? <Fact label="Estimated volume">{formatVolume(e.volumeMl, unit)}</Fact> : null}
                {e?.vocGPerL != null ? <Fact label="Mixed VOC">{formatNumber(e.vocGPerL, 0)} g/L</Fact> : null}
                {e?.costCents != null && e.volumeMl > 0 ? <Fact label="Material cost">{formatCents(e.costCents)}</Fact> : null}
              </dl>
              <div className="flex flex-col gap-2">
                {e?.vocOverLimit && e.vocGPerL != null && e.vocLimitGPerL != null ? <VocOverLimit kind={l.kind} gPerL={e.vocGPerL} limitGPerL={e.vocLimitGPerL} /> : null}
                {l.components.length ? (
                  <ul className="text-sm">
                    {l.components.map((c) => (
                      <li key={c.id} className="flex gap-2">
                        <span className="w-20 shrink-0 font-semibold">{c.label}</span>
                        <Link to={paths.material(c.materialId)} className="min-w-0 underline-offset-2 hover:underline">
                          <span className="font-mono text-xs">{c.materialCode}</span> {c.materialName}
                        </Link>
                      </li>
                    ))}
                  </ul>
                ) : null}
                {e?.problem ? <p className="text-sm font-medium text-flake-800">Estimate: {e.problem}</p> : null}
                {l.notes ? <p className="text-sm whitespace-pre-line text-primer-700">{l.notes}</p> : null}
              </div>
            </div>
            {l.cautions.length ? <SafetyCautions cautions={l.cautions} compact className="mx-4 mb-3" /> : null}
          </li>
        );
      })}
    </ol>
  );
}

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-xs font-semibold text-primer-700">{label}</dt>
      <dd className="text-ink-950 tabular-nums">{children}</dd>
    </div>
  );
}

/** The whole job's estimate: volume per layer and total, VOC, and (for the office) the material cost. */
export function EstimateTable({ estimate, unit = "mL" }: { estimate: PlanEstimateDto; unit?: VolumeUnit }) {
  const showCost = estimate.totalCostCents !== undefined;
  return (
    <div className="scrollbar-thin overflow-x-auto">
      <table className="w-full text-left text-sm" aria-label="Material estimate">
        <thead className="bg-primer-100">
          <tr>
            <th scope="col" className="px-2 py-2 font-semibold">Layer</th>
            <th scope="col" className="px-2 py-2 text-right font-semibold">Ready to spray</th>
            <th scope="col" className="px-2 py-2 text-right font-semibold">VOC g/L</th>
            {showCost ? <th scope="col" className="px-3 py-2 text-right font-semibold">Cost</th> : null}
          </tr>
        </thead>
        <tbody>
          {estimate.layers.map((l) => (
            <tr key={l.layerId} className="border-t border-primer-100">
              <th scope="row" className="px-3 py-2 font-medium">
                {l.name}
                {l.problem ? <span className="block text-xs font-normal text-flake-800">{l.problem}</span> : null}
              </th>
              <td className="px-3 py-2 text-right tabular-nums">{l.volumeMl > 0 ? formatVolume(l.volumeMl, unit) : "—"}</td>
              <td className={cn("px-3 py-2 text-right tabular-nums", l.vocOverLimit && "font-semibold text-red-800")}>
                {l.vocGPerL == null ? "—" : formatNumber(l.vocGPerL, 0)}
                {l.vocOverLimit ? <span className="block text-xs">over the {formatNumber(l.vocLimitGPerL ?? 0, 0)} g/L limit</span> : null}
              </td>
              {showCost ? <td className="px-3 py-2 text-right tabular-nums">{l.volumeMl > 0 && l.costCents != null ? formatCents(l.costCents) : "—"}</td> : null}
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr className="border-t border-primer-200 bg-primer-50 font-semibold">
            <th scope="row" className="px-3 py-2">Whole job ({formatNumber(estimate.totalAreaM2, 2)} m²)</th>
            <td className="px-3 py-2 text-right tabular-nums">{formatVolume(estimate.totalVolumeMl, unit)}</td>
            <td className="px-3 py-2" />
            {showCost ? <td className="px-3 py-2 text-right tabular-nums">{formatCents(estimate.totalCostCents ?? 0)}</td> : null}
          </tr>
        </tfoot>
      </table>
      <p className="mt-2 text-xs text-primer-700">
        From the items&apos; areas, each layer&apos;s coats and film, the mixed volume solids and the transfer efficiency. An estimate for buying and quoting; the maker&apos;s data sheets govern.
      </p>
    </div>
  );
}
