import { ACCENT, INK, MUTED, NUM, RULE, newPdfDocument } from "../../pdf/pdf-document";
import type { ShopSettings } from "../../../shared/schemas/settings.schema";
import { QUOTE_STATUS_LABELS, type QuoteStatus } from "../../../shared/schemas/quote.schema";
import { SUBSTRATE_LABELS, type Substrate } from "../../../shared/domain/substrates";
import { customerLineDetail, formatCents, formatPercent, taxLabel, type QuoteLine, type QuoteTotals, type TaxableKind } from "../../../shared/quote/index";
import { longDate, mediumDate } from "../messages/compose";


export type QuotePdfData = {
  shop: ShopSettings;
  quoteId: number;
  version: number;
  status: QuoteStatus;
  issuedAt: number;
  validUntil: string;
  customer: { name: string; email: string | null; phone: string | null; address: string | null };
  job: { id: number; title: string };
  items: { name: string; substrate: string; surfaceArea: number; areaUnit: string }[];
  finishText: string | null;
  intro: string | null;
  terms: string | null;
  lines: QuoteLine[];
  totals: QuoteTotals;
  taxPercent: number;
  taxedKinds: TaxableKind[];
  depositPercent: number;
};


/** Renders a quote as a US Letter PDF and resolves with its bytes. */
export function renderQuotePdf(d: QuotePdfData): Promise<Buffer> {
  const { doc, done, left, width, bottom, ensure, heading, footer } = newPdfDocument({ Title: `Quote #${d.quoteId} v${d.version}: ${d.job.title}`, Author: d.shop.shopName, Subject: "Quote" });

  // ---- header: shop on the left, quote facts on the right ----
  const top = doc.y;
  doc.font("bold").fontSize(18).fillColor(INK).text(d.shop.shopName, left, top, { width: width * 0.58 });
  doc.font("body").fontSize(9.5).fillColor(MUTED);
  for (const line of [d.shop.shopAddress, [d.shop.shopPhone, d.shop.shopEmail].filter(Boolean).join("  ·  ")].filter(Boolean)) {
    doc.text(line, { width: width * 0.58 });
  }
  const leftBottom = doc.y;
  const rx = left + width * 0.6;
  const rw = width * 0.4;
  doc.font("bold").fontSize(20).fillColor(ACCENT).text("Quote", rx, top, { width: rw, align: "right" });
  doc.font("body").fontSize(9.5).fillColor(INK);
  const facts: [string, string][] = [
    ["Quote", `#${d.quoteId}, version ${d.version}`],
    ["Date", mediumDate(new Date(d.issuedAt).toISOString().slice(0, 10))],
    ["Valid until", mediumDate(d.validUntil)],
  ];
  if (d.status !== "sent" && d.status !== "viewed") facts.push(["Status", QUOTE_STATUS_LABELS[d.status]]);
  doc.moveDown(0.3);
  for (const [k, v] of facts) {
    const y = doc.y;
    doc.font("medium").fillColor(MUTED).text(k, rx, y, { width: rw * 0.4, ...NUM });
    doc.font("body").fillColor(INK).text(v, rx + rw * 0.3, y, { width: rw * 0.7, align: "right", ...NUM });
  }
  doc.y = Math.max(leftBottom, doc.y) + 10;
  doc.moveTo(left, doc.y).lineTo(left + width, doc.y).lineWidth(1).strokeColor(RULE).stroke();
  doc.moveDown(0.6);

  // ---- customer and job ----
  const blockTop = doc.y;
  doc.font("bold").fontSize(10.5).fillColor(ACCENT).text("PREPARED FOR", left, blockTop, { characterSpacing: 0.6 });
  doc.font("medium").fontSize(11).fillColor(INK).text(d.customer.name, { width: width / 2 - 10 });
  doc.font("body").fontSize(9.5).fillColor(MUTED);
  for (const line of [d.customer.address, d.customer.email, d.customer.phone]) if (line) doc.text(line, { width: width / 2 - 10 });
  const custBottom = doc.y;
  doc.font("bold").fontSize(10.5).fillColor(ACCENT).text("JOB", left + width / 2, blockTop, { characterSpacing: 0.6 });
  doc.font("medium").fontSize(11).fillColor(INK).text(`#${d.job.id}  ${d.job.title}`, left + width / 2, doc.y, { width: width / 2 });
  doc.font("body").fontSize(9.5).fillColor(MUTED);
  for (const item of d.items) {
    const area = `${Number(item.surfaceArea.toFixed(2))} ${item.areaUnit === "ft2" ? "sq ft" : "m²"}`;
    doc.text(`${item.name}: ${SUBSTRATE_LABELS[item.substrate as Substrate] ?? item.substrate}, ${area}`, left + width / 2, doc.y, { width: width / 2 });
  }
  doc.y = Math.max(custBottom, doc.y);
  doc.x = left;

  if (d.finishText) {
    heading("The finish");
    doc.font("body").fontSize(10.5).fillColor(INK).text(d.finishText, left, doc.y, { width });
  }
  if (d.intro) {
    doc.moveDown(0.8);
    doc.font("body").fontSize(10.5).fillColor(INK).text(d.intro, left, doc.y, { width });
  }

  // ---- lines ----
  heading("What the work costs");
  const col = { desc: left, detail: left + width * 0.55, amount: left + width * 0.78 };
  const amountW = width * 0.22;
  const th = (y: number) => {
    doc.font("medium").fontSize(9).fillColor(MUTED);
    doc.text("Description", col.desc, y, { width: width * 0.53 });
    doc.text("Details", col.detail, y, { width: width * 0.22 });
    doc.text("Amount", col.amount, y, { width: amountW, align: "right" });
    doc.moveTo(left, doc.y + 3).lineTo(left + width, doc.y + 3).lineWidth(0.6).strokeColor(RULE).stroke();
    doc.y += 7;
  };
  th(doc.y);
  d.lines.forEach((line, i) => {
    const t = d.totals.lines[i]!;
    const desc = `${line.description}${t.taxed ? " *" : ""}`;
    doc.font("body").fontSize(10);
    const h = Math.max(doc.heightOfString(desc, { width: width * 0.53 }), 12) + 6;
    if (doc.y + h > bottom()) {
      doc.addPage();
      th(doc.y);
    }
    const y = doc.y;
    doc.fillColor(INK).text(desc, col.desc, y, { width: width * 0.53 });
    doc.fillColor(MUTED).text(customerLineDetail(line) ?? "", col.detail, y, { width: width * 0.22, ...NUM });
    doc.fillColor(INK).text(formatCents(t.amountCents), col.amount, y, { width: amountW, align: "right", ...NUM });
    doc.y = y + h;
  });
  doc.moveTo(left, doc.y).lineTo(left + width, doc.y).lineWidth(0.6).strokeColor(RULE).stroke();
  doc.y += 6;

  // ---- totals ----
  const rows: [string, string, boolean?][] = [["Subtotal", formatCents(d.totals.subtotalCents)]];
  if (d.totals.discountCents > 0) rows.splice(0, 0, ["Charges before discount", formatCents(d.totals.grossCents)], ["Discount", `-${formatCents(d.totals.discountCents)}`]);
  rows.push([taxLabel(d.taxPercent, d.taxedKinds), formatCents(d.totals.taxCents)]);
  rows.push(["Total", formatCents(d.totals.totalCents), true]);
  rows.push([`Deposit to book the work (${formatPercent(d.depositPercent)})`, formatCents(d.totals.depositCents), true]);
  rows.push(["Balance due on collection", formatCents(d.totals.balanceCents)]);
  ensure(rows.length * 18 + 20);
  for (const [label, value, strong] of rows) {
    const y = doc.y;
    doc.font(strong ? "bold" : "body").fontSize(strong ? 11.5 : 10).fillColor(INK);
    doc.text(label, left + width * 0.3, y, { width: width * 0.48, align: "right", ...NUM });
    doc.text(value, col.amount, y, { width: amountW, align: "right", ...NUM });
    doc.y = Math.max(doc.y, y + (strong ? 17 : 15));
  }
  if (d.totals.lines.some((l) => l.taxed)) {
    doc.moveDown(0.4);
    doc.font("body").fontSize(8.5).fillColor(MUTED).text("* Sales tax applies to this line.", left, doc.y, { width });
  }
  doc.font("body").fontSize(8.5).fillColor(MUTED).text(
    "Materials are priced from the shop's estimate of what the finish needs. Amounts are in US dollars; sales tax is rounded half-up to the cent.",
    left,
    doc.y + 2,
    { width },
  );

  if (d.terms) {
    heading("Terms");
    doc.font("body").fontSize(9.5).fillColor(INK).text(d.terms, left, doc.y, { width });
  }
  heading("How to accept");
  doc
    .font("body")
    .fontSize(9.5)
    .fillColor(INK)
    .text(
      `Approve the quote and pay the deposit online from the link in our e-mail, or sign in to your account. This quote is valid until ${longDate(d.validUntil)}.`,
      left,
      doc.y,
      { width },
    );

  footer(`${d.shop.shopName}  ·  Quote #${d.quoteId} v${d.version}`);
  doc.end();
  return done;
}
