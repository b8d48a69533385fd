import { formatMinutes } from "@shared/domain/duration";
import { MixWordsList } from "@/components/ui/mix-words-list";
import { FileDown, Printer, TriangleAlert } from "lucide-react";
import { LAYER_KIND_LABELS } from "@shared/domain/layers";
import { SUBSTRATE_LABELS } from "@shared/domain/substrates";
import type { FinishCoatDto, FinishLayerDto, FinishRecordDto } from "@shared/schemas/finish-record.schema";
import { formatDateTime } from "@/utils/format-date";

/** Hides the app frame when printing, so only the record goes on paper. */
const PRINT_CSS = `@media print {
  header, nav, .no-print { display: none !important; }
  main { padding: 0 !important; }
  body, html { background: #fff !important; }
  .finish-record section { break-inside: avoid; }
}`;

const ml = (n: number | null) => (n == null ? "—" : `${Number(n.toFixed(1))} mL`);
const RULES: Record<FinishCoatDto["overrides"][number]["rule"], string> = { prep: "Sprayed before prep sign-off", timing: "Sprayed against a timing rule", change: "Change not yet approved" };


/**
 * What was really sprayed on a job, layer by layer: the page a shop prints and files so the finish can be repaired
 * or repeated. Display only (the portal shows it too): the caller fetches the record.
 */
export function FinishRecordView({ record, pdfUrl }: { record: FinishRecordDto; pdfUrl: string }) {
  const r = record;
  return (
    <article className="finish-record flex flex-col gap-6 text-ink-950" aria-labelledby="finish-record-title">
      <style>{PRINT_CSS}</style>
      <div className="no-print flex flex-wrap gap-2">
        <button
          type="button"
          onClick={() => window.print()}
          className="inline-flex min-h-12 items-center gap-2 rounded-lg bg-candy-600 px-5 text-base font-semibold text-white shadow-card hover:bg-candy-700"
        >
          <Printer aria-hidden className="size-5" />
          Print
        </button>
        <a href={pdfUrl} className="inline-flex min-h-12 items-center gap-2 rounded-lg border border-primer-300 bg-white px-5 text-base font-semibold text-ink-950 shadow-card hover:bg-primer-100">
          <FileDown aria-hidden className="size-5" />
          PDF
        </a>
      </div>
      <header className="flex flex-col gap-1">
        <p className="text-sm font-semibold tracking-wide text-primer-800 uppercase">Finish record · job #{r.job.id}</p>
        <h1 id="finish-record-title" className="text-3xl font-bold">
          {r.job.title}
        </h1>
        <p className="text-lg">{r.job.customerName}</p>
        <ul className="text-base text-primer-900">
          {r.job.items.map((i) => (
            <li key={i.name}>
              {i.name}: {SUBSTRATE_LABELS[i.substrate]}, {Number(i.surfaceArea.toFixed(2))} {i.areaUnit === "ft2" ? "sq ft" : "m²"}
            </li>
          ))}
        </ul>
        {r.plan ? (
          <p className="text-base text-primer-900">
            Plan {r.plan.name}, version {r.plan.version}
            {r.painters.length ? ` · sprayed by ${r.painters.join(", ")}` : ""}
          </p>
        ) : (
          <p className="text-base text-primer-900">No finish plan.</p>
        )}
        {r.approvedPanel ? (
          <p className="text-base">
            Approved colour: panel #{r.approvedPanel.id}, {r.approvedPanel.label}
            {r.approvedPanel.lab ? ` · L* ${r.approvedPanel.lab.L} a* ${r.approvedPanel.lab.a} b* ${r.approvedPanel.lab.b} (D65)` : ""}
            {r.approvedPanel.setupSummary ? ` · sprayed with ${r.approvedPanel.setupSummary}` : ""}
          </p>
        ) : null}
      </header>

      {r.prep.length ? (
        <section aria-labelledby="record-prep" className="rounded-xl border border-primer-200 bg-white p-4">
          <h2 id="record-prep" className="text-xl font-semibold">
            Prep
          </h2>
          <ul className="mt-2 flex flex-col gap-2">
            {r.prep.map((p) => (
              <li key={p.itemName}>
                <span className="font-semibold">{p.itemName}</span> ({SUBSTRATE_LABELS[p.substrate]}): {p.steps.length ? p.steps.join("; ") : "no prep steps recorded"}.{" "}
                {p.signedOffAt ? `Signed off by ${p.signedOffByName ?? "a former user"}, ${formatDateTime(p.signedOffAt)}.` : "Not signed off."}
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      {r.layers.map((layer) => (
        <LayerRecord key={layer.id} layer={layer} />
      ))}
      <p className="text-sm text-primer-800">Made {formatDateTime(r.generatedAt)} from the shop&apos;s records. Times are when each coat was sprayed.</p>
    </article>
  );
}

function LayerRecord({ layer }: { layer: FinishLayerDto }) {
  const headingId = `record-layer-${layer.id}`;
  return (
    <section aria-labelledby={headingId} className="rounded-xl border border-primer-200 bg-white p-4">
      <h2 id={headingId} className="text-xl font-semibold">
        {layer.position}. {layer.name} <span className="text-base font-normal text-primer-800">({LAYER_KIND_LABELS[layer.kind]})</span>
      </h2>
      <MixWordsList components={layer.components} className="mt-1" />
      <p className="text-primer-900">
        {layer.kind === "prep"
          ? "Done through the prep records above."
          : `Planned ${layer.plannedCoats} ${layer.plannedCoats === 1 ? "coat" : "coats"}, flash ${formatMinutes(layer.flashMinutes)}, dry ${formatMinutes(layer.dryMinutes)} before the next layer.`}
      </p>
      {layer.materials.length ? (
        <p>
          Materials:{" "}
          {layer.materials.map((m) => `${m.code} ${m.name}${m.lots.length ? ` (lot ${m.lots.join(", ")})` : ""}`).join("; ")}
        </p>
      ) : null}
      {layer.cautions.length ? <p className="mt-1 text-sm text-primer-900">{layer.cautions.map((c) => c.title).join(" · ")}</p> : null}
      {layer.batches.map((b) => (
        <table key={b.id} className="mt-3 w-full text-left text-sm" aria-label={`Batch ${b.id} of ${layer.name}`}>
          <caption className="text-left font-semibold">
            Batch #{b.id}, mixed {b.mixedAt ? formatDateTime(b.mixedAt) : "—"}
            {b.mixedByName ? ` by ${b.mixedByName}` : ""}: {ml(b.totalMl)}
            {b.vocGPerL != null ? `, VOC ${Math.round(b.vocGPerL)} g/L` : ""}
          </caption>
          <thead>
            <tr className="border-b border-primer-200">
              <th scope="col" className="py-1 pr-3">Material</th>
              <th scope="col" className="py-1 pr-3">Planned</th>
              <th scope="col" className="py-1 pr-3">Poured</th>
              <th scope="col" className="py-1">Lot</th>
            </tr>
          </thead>
          <tbody>
            {b.lines.map((l, i) => (
              <tr key={i} className="border-b border-primer-100">
                <td className="py-1 pr-3">
                  {l.materialCode} {l.materialName} (“{l.label}”)
                </td>
                <td className="py-1 pr-3 tabular-nums">{ml(l.plannedMl)}</td>
                <td className="py-1 pr-3 tabular-nums">{ml(l.pouredMl)}</td>
                <td className="py-1">{l.lotNumber ?? "—"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ))}
      {layer.coats.length ? (
        <table className="mt-3 w-full text-left text-sm" aria-label={`Coats of ${layer.name}`}>
          <thead>
            <tr className="border-b border-primer-200">
              <th scope="col" className="py-1 pr-3">Coat</th>
              <th scope="col" className="py-1 pr-3">Sprayed</th>
              <th scope="col" className="py-1 pr-3">Painter</th>
              <th scope="col" className="py-1 pr-3">Booth</th>
              <th scope="col" className="py-1">Set-up</th>
            </tr>
          </thead>
          <tbody>
            {layer.coats.map((c) => (
              <tr key={c.coatNumber} className="border-b border-primer-100 align-top">
                <td className="py-1 pr-3 font-semibold tabular-nums">{c.coatNumber}</td>
                <td className="py-1 pr-3 tabular-nums">
                  {formatDateTime(c.at)}
                  {c.correctionReason ? <span className="block text-primer-800">Corrected: {c.correctionReason}</span> : null}
                </td>
                <td className="py-1 pr-3">{c.painterName ?? "—"}</td>
                <td className="py-1 pr-3 tabular-nums">
                  {[c.boothTemp != null ? `${c.boothTemp} °${c.tempUnit ?? ""}` : null, c.humidityPct != null ? `${c.humidityPct} % RH` : null].filter(Boolean).join(", ") || "—"}
                </td>
                <td className="py-1">
                  {c.setup.summary || "—"}
                  {c.overrides.map((o) => (
                    <span key={o.rule} className="mt-1 flex items-start gap-1 font-semibold text-red-800">
                      <TriangleAlert aria-hidden className="mt-0.5 size-4 shrink-0" />
                      {RULES[o.rule]}: {o.reason}
                    </span>
                  ))}
                  {c.note ? <span className="block text-primer-800">Note: {c.note}</span> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : layer.kind === "prep" ? null : (
        <p className="mt-2 text-primer-800">No coats logged.</p>
      )}
    </section>
  );
}
