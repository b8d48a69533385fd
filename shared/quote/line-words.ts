import { formatCents, formatPercent } from "./money";
import type { QuoteLine, TaxableKind } from "./totals";
import { QUOTE_LINE_KIND_LABELS } from "./totals";

/**
 * The "how it was worked out" text a customer may read for a line: hours and rate for labour, the percent for
 * percent-based supplies and discounts. Materials show their price only (the shop's cost and markup stay inside).
 */
export function customerLineDetail(line: QuoteLine): string | null {
  switch (line.kind) {
    case "labour":
      return `${Number((line.hours ?? 0).toFixed(2))} h × ${formatCents(line.rateCents ?? 0)}/h`;
    case "supplies":
      return line.basis === "percent" ? `${formatPercent(line.percent ?? 0)} of labour` : null;
    case "discount":
      return line.basis === "percent" ? `${formatPercent(line.percent ?? 0)} off` : null;
    default:
      return null;
  }
}

/** "7.25 % on materials and shop supplies" */
export function taxLabel(taxPercent: number, taxedKinds: readonly TaxableKind[]): string {
  if (!taxPercent || taxedKinds.length === 0) return "Sales tax";
  const names = taxedKinds.map((k) => QUOTE_LINE_KIND_LABELS[k].toLowerCase());
  const list = names.length > 1 ? `${names.slice(0, -1).join(", ")} and ${names.at(-1)}` : names[0];
  return `Sales tax (${formatPercent(taxPercent)} on ${list})`;
}
