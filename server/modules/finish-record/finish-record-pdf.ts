import { formatMinutes } from "../../../shared/domain/duration";
import { mixComponentWords, plainNumber } from "../../../shared/domain/mix-words";
import type { FinishRecordDto } from "../../../shared/schemas/finish-record.schema";
import { LAYER_KIND_LABELS } from "../../../shared/domain/layers";
import { SUBSTRATE_LABELS } from "../../../shared/domain/substrates";
import { ACCENT, INK, MUTED, NUM, RULE, newPdfDocument } from "../../pdf/pdf-document";

const when = (isoTime: string | null) => (isoTime ? new Date(isoTime).toISOString().slice(0, 16).replace("T", " ") + " UTC" : "—");
const ml = (n: number | null) => (n == null ? "—" : `${Number(n.toFixed(1))} mL`);
const conditions = (c: { boothTemp: number | null; tempUnit: string | null; humidityPct: number | null }) =>
  [c.boothTemp != null ? `${c.boothTemp} °${c.tempUnit ?? ""}` : null, c.humidityPct != null ? `${c.humidityPct} % RH` : null].filter(Boolean).join(", ");

/** The finish record as a US Letter PDF: one section per layer, what was mixed and what was sprayed. */
export function renderFinishRecordPdf(d: FinishRecordDto, shopName: string): Promise<Buffer> {
  const { doc, done, left, width, ensure, heading, footer } = newPdfDocument({ Title: `Finish record: job #${d.job.id} ${d.job.title}`, Author: shopName, Subject: "Finish record" });
  const line = (text: string, opts: { font?: "body" | "medium" | "bold"; size?: number; color?: string; indent?: number } = {}) => {
    doc.font(opts.font ?? "body").fontSize(opts.size ?? 9.5).fillColor(opts.color ?? INK);
    ensure(doc.heightOfString(text, { width: width - (opts.indent ?? 0) }) + 2);
    doc.text(text, left + (opts.indent ?? 0), doc.y, { width: width - (opts.indent ?? 0), ...NUM });
  };

  doc.font("bold").fontSize(18).fillColor(INK).text(shopName, left, doc.y, { width });
  doc.font("bold").fontSize(16).fillColor(ACCENT).text("Finish record", { width });
  line(`Job #${d.job.id}  ${d.job.title}  ·  ${d.job.customerName}`, { font: "medium", size: 11 });
  for (const i of d.job.items) line(`${i.name}: ${SUBSTRATE_LABELS[i.substrate] ?? i.substrate}, ${Number(i.surfaceArea.toFixed(2))} ${i.areaUnit === "ft2" ? "sq ft" : "m²"}`, { color: MUTED });
  if (d.plan) line(`Plan: ${d.plan.name}, version ${d.plan.version}${d.plan.frozenAt ? ` (first used at the booth ${when(d.plan.frozenAt)})` : ""}`, { color: MUTED });
  if (d.painters.length) line(`Sprayed by ${d.painters.join(", ")}`, { color: MUTED });
  if (d.approvedPanel) {
    const lab = d.approvedPanel.lab ? `  ·  L* ${d.approvedPanel.lab.L} a* ${d.approvedPanel.lab.a} b* ${d.approvedPanel.lab.b} (D65)` : "";
    line(`Approved colour: panel #${d.approvedPanel.id}, ${d.approvedPanel.label}${lab}`, { color: MUTED });
    if (d.approvedPanel.setupSummary) line(`Panel sprayed with: ${d.approvedPanel.setupSummary}`, { color: MUTED });
  }
  doc.moveDown(0.4);
  doc.moveTo(left, doc.y).lineTo(left + width, doc.y).lineWidth(1).strokeColor(RULE).stroke();

  if (d.prep.length) {
    heading("Prep");
    for (const p of d.prep) {
      line(`${p.itemName} (${SUBSTRATE_LABELS[p.substrate] ?? p.substrate})`, { font: "medium" });
      line(p.steps.length ? p.steps.join("; ") : "No prep steps recorded", { indent: 12 });
      line(p.signedOffAt ? `Signed off by ${p.signedOffByName ?? "a former user"}, ${when(p.signedOffAt)}` : "Not signed off", { indent: 12, color: MUTED });
    }
  }

  for (const layer of d.layers) {
    heading(`${layer.position}. ${layer.name} (${LAYER_KIND_LABELS[layer.kind]})`);
    for (const w of mixComponentWords(layer.components)) {
      line(`${w.material} ("${w.label}"): ${w.amount}${w.readyPct !== null ? `, ${plainNumber(w.readyPct, 1)} % of the ready-to-spray mix` : ""}`, { indent: 8 });
    }
    if (layer.kind === "prep") line("Done through the prep records above.", { color: MUTED });
    else line(`Planned ${layer.plannedCoats} ${layer.plannedCoats === 1 ? "coat" : "coats"}, flash ${formatMinutes(layer.flashMinutes)}, dry ${formatMinutes(layer.dryMinutes)} before the next layer`, { color: MUTED });
    if (layer.materials.length)
      line(`Materials: ${layer.materials.map((m) => `${m.code} ${m.name}${m.lots.length ? ` (lot ${m.lots.join(", ")})` : ""}`).join("; ")}`);
    for (const b of layer.batches) {
      line(`Batch #${b.id}, mixed ${when(b.mixedAt)}${b.mixedByName ? ` by ${b.mixedByName}` : ""}: ${ml(b.totalMl)}${b.vocGPerL != null ? `, VOC ${Math.round(b.vocGPerL)} g/L` : ""}`, { font: "medium", indent: 12 });
      for (const l of b.lines) line(`${l.materialCode} ${l.materialName} (${l.label}): planned ${ml(l.plannedMl)}, poured ${ml(l.pouredMl)}${l.lotNumber ? `, lot ${l.lotNumber}` : ""}`, { indent: 24 });
    }
    if (!layer.coats.length && layer.kind !== "prep") line("No coats logged.", { indent: 12, color: MUTED });
    for (const c of layer.coats) {
      const parts = [`Coat ${c.coatNumber}: ${when(c.at)}`, c.painterName, conditions(c), c.setup.summary].filter(Boolean);
      line(parts.join("  ·  "), { indent: 12 });
      if (c.at.slice(0, 16) !== c.loggedAt.slice(0, 16)) line(`Entered ${when(c.loggedAt)}`, { indent: 24, color: MUTED });
      for (const o of c.overrides) line(`Went ahead past the ${o.rule} rule: ${o.reason}`, { indent: 24, color: ACCENT });
      if (c.correctionReason) line(`Corrected: ${c.correctionReason}`, { indent: 24, color: MUTED });
      if (c.note) line(`Note: ${c.note}`, { indent: 24, color: MUTED });
    }
    if (layer.cautions.length) line(layer.cautions.map((x) => x.title).join(" · "), { size: 8.5, color: MUTED, indent: 12 });
  }

  doc.moveDown(0.8);
  line(`Made ${when(d.generatedAt)} from the shop's records. Times are when each coat was sprayed.`, { size: 8.5, color: MUTED });
  footer(`${shopName}  ·  Finish record, job #${d.job.id}`);
  doc.end();
  return done;
}
