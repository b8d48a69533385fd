import { mulDivRoundHalfUp, percentOfCents, toUnits } from "./money";

/**
 * Quote totals: the one computation the quote editor (live preview), the server (stored totals), the PDF and
 * the portal all use. Pure, integer cents in and out.
 *
 * Rounding rule (one, documented): every fractional cent is rounded half away from zero, i.e. half-up for
 * positive amounts (US SSUTA §324; references.md §10). Each line's extension is rounded once; sales tax is
 * rounded once on the whole invoice by default ("invoice"), or once per taxed line ("line"), which the same
 * SSUTA section also allows. The deposit is rounded once from the total.
 *
 * Order of work:
 *  1. line amounts: labour = hours × rate; materials = cost + markup % of cost; supplies = fixed, or percent of
 *     the labour total; sublet (shown as "Outside work") = amount; discount = fixed, or percent of everything above (the gross);
 *  2. subtotal = gross − discounts;
 *  3. the discount lowers the taxed base in proportion: taxed share = discount × taxed gross / gross (rounded);
 *  4. tax = tax % of the taxed base (invoice) or the sum of tax % of each taxed line less tax % of the taxed share
 *     of the discount (line);
 *  5. total = subtotal + tax; deposit = deposit % of total; balance = total − deposit.
 */

export const QUOTE_LINE_KINDS = ["labour", "materials", "supplies", "sublet", "discount"] as const;
export type QuoteLineKind = (typeof QUOTE_LINE_KINDS)[number];

/** Line kinds that can carry sales tax (the shop's settings choose which do). */
export const TAXABLE_KINDS = ["labour", "materials", "supplies", "sublet"] as const;
export type TaxableKind = (typeof TAXABLE_KINDS)[number];

export const QUOTE_LINE_KIND_LABELS: Record<QuoteLineKind, string> = {
  labour: "Labour",
  materials: "Materials",
  supplies: "Shop supplies",
  sublet: "Outside work",
  discount: "Discount",
};

export type TaxRounding = "invoice" | "line";

/**
 * One quote line. Which fields matter depends on `kind`:
 * labour: hours, rateCents · materials: costCents, markupPercent · supplies: basis "percent" (of labour) with
 * percent, or "fixed" with amountCents · sublet: amountCents · discount: basis "percent" (of the gross) with
 * percent, or "fixed" with amountCents (a positive number that is taken off).
 */
export type QuoteLine = {
  kind: QuoteLineKind;
  description: string;
  hours?: number | null;
  rateCents?: number | null;
  costCents?: number | null;
  markupPercent?: number | null;
  basis?: "percent" | "fixed" | null;
  percent?: number | null;
  amountCents?: number | null;
  /** Where a materials line came from (the finish plan's layer), kept for refreshing it later. */
  layerId?: number | null;
};

export type TotalsOptions = {
  /** Sales tax, percent with up to 4 decimals (7.25). */
  taxPercent: number;
  /** The line kinds the tax applies to (the shop's setting `taxAppliesTo`). */
  taxedKinds: readonly TaxableKind[];
  depositPercent: number;
  taxRounding?: TaxRounding;
};

export type LineTotal = {
  kind: QuoteLineKind;
  /** The line's money: positive for charges, negative for a discount. */
  amountCents: number;
  taxed: boolean;
};

export type QuoteTotals = {
  lines: LineTotal[];
  labourCents: number;
  materialsCents: number;
  suppliesCents: number;
  subletCents: number;
  /** The sum of all discounts, as a positive number. */
  discountCents: number;
  /** Charges before discounts. */
  grossCents: number;
  /** Gross less discounts, before tax. */
  subtotalCents: number;
  /** The part of the subtotal that tax is charged on. */
  taxableCents: number;
  taxCents: number;
  totalCents: number;
  depositCents: number;
  balanceCents: number;
  taxRounding: TaxRounding;
};

const n = (v: number | null | undefined) => (typeof v === "number" && Number.isFinite(v) ? v : 0);

/** The money of one line that does not depend on other lines (everything except percent supplies and percent discounts). */
function ownAmount(line: QuoteLine): number {
  switch (line.kind) {
    case "labour":
      // Hours carry up to 2 decimals: hundredths of an hour × rate / 100.
      return mulDivRoundHalfUp(toUnits(n(line.hours), 2), Math.round(n(line.rateCents)), 100);
    case "materials": {
      const cost = Math.round(n(line.costCents));
      return cost + percentOfCents(cost, n(line.markupPercent));
    }
    case "sublet":
      return Math.round(n(line.amountCents));
    case "supplies":
      return line.basis === "percent" ? 0 : Math.round(n(line.amountCents));
    case "discount":
      return line.basis === "percent" ? 0 : -Math.round(n(line.amountCents));
  }
}

export function computeQuoteTotals(lines: readonly QuoteLine[], options: TotalsOptions): QuoteTotals {
  const rounding: TaxRounding = options.taxRounding ?? "invoice";
  const taxed = new Set<QuoteLineKind>(options.taxedKinds);
  const amounts = lines.map(ownAmount);

  const sumOf = (kind: QuoteLineKind) => amounts.reduce((s, a, i) => (lines[i]!.kind === kind ? s + a : s), 0);
  const labourCents = sumOf("labour");
  // Percent supplies are a share of the labour total.
  lines.forEach((line, i) => {
    if (line.kind === "supplies" && line.basis === "percent") amounts[i] = percentOfCents(labourCents, n(line.percent));
  });
  const grossCents = amounts.reduce((s, a, i) => (lines[i]!.kind === "discount" ? s : s + a), 0);
  // Percent discounts are a share of the gross (all charges).
  lines.forEach((line, i) => {
    if (line.kind === "discount" && line.basis === "percent") amounts[i] = -percentOfCents(grossCents, n(line.percent));
  });

  const discountCents = -sumOf("discount");
  const subtotalCents = grossCents - discountCents;
  const isTaxed = (i: number) => lines[i]!.kind !== "discount" && taxed.has(lines[i]!.kind);
  const taxedGross = amounts.reduce((s, a, i) => (isTaxed(i) ? s + a : s), 0);
  const discountTaxedShare = grossCents > 0 ? mulDivRoundHalfUp(discountCents, taxedGross, grossCents) : 0;
  const taxableCents = taxedGross - discountTaxedShare;

  let taxCents: number;
  if (rounding === "line") {
    taxCents = amounts.reduce((s, a, i) => (isTaxed(i) ? s + percentOfCents(a, options.taxPercent) : s), 0);
    taxCents -= percentOfCents(discountTaxedShare, options.taxPercent);
  } else {
    taxCents = percentOfCents(taxableCents, options.taxPercent);
  }

  const totalCents = subtotalCents + taxCents;
  const depositCents = percentOfCents(totalCents, options.depositPercent);
  return {
    lines: lines.map((line, i) => ({ kind: line.kind, amountCents: amounts[i]!, taxed: isTaxed(i) })),
    labourCents,
    materialsCents: sumOf("materials"),
    suppliesCents: amounts.reduce((s, a, i) => (lines[i]!.kind === "supplies" ? s + a : s), 0),
    subletCents: sumOf("sublet"),
    discountCents,
    grossCents,
    subtotalCents,
    taxableCents,
    taxCents,
    totalCents,
    depositCents,
    balanceCents: totalCents - depositCents,
    taxRounding: rounding,
  };
}
