import { formatCents, formatPercent, QUOTE_LINE_KIND_LABELS, taxLabel, type QuoteTotals, type TaxableKind } from "@shared/quote/index";
import { cn } from "@/utils/cn";

/** The totals block: what the customer pays, how the tax was reached, and the deposit that books the work. */
export function QuoteTotalsList({
  totals,
  taxPercent,
  taxedKinds,
  depositPercent,
  paidCents,
  className,
  live = false,
}: {
  totals: QuoteTotals;
  taxPercent: number;
  taxedKinds: readonly TaxableKind[];
  depositPercent: number;
  paidCents?: number;
  className?: string;
  /** Recomputed while typing: announce changes politely. */
  live?: boolean;
}) {
  const rows: { label: string; value: string; strong?: boolean; muted?: boolean }[] = [
    { label: "Labour", value: formatCents(totals.labourCents), muted: true },
    { label: "Materials (with markup)", value: formatCents(totals.materialsCents), muted: true },
    { label: "Shop supplies", value: formatCents(totals.suppliesCents), muted: true },
    ...(totals.subletCents ? [{ label: QUOTE_LINE_KIND_LABELS.sublet, value: formatCents(totals.subletCents), muted: true }] : []),
    ...(totals.discountCents ? [{ label: "Discount", value: `-${formatCents(totals.discountCents)}`, muted: true }] : []),
    { label: "Subtotal", value: formatCents(totals.subtotalCents) },
    { label: `${taxLabel(taxPercent, taxedKinds)}${totals.taxRounding === "line" ? ", per line" : ""}`, value: formatCents(totals.taxCents) },
    { label: "Total", value: formatCents(totals.totalCents), strong: true },
    { label: `Deposit (${formatPercent(depositPercent)})`, value: formatCents(totals.depositCents), strong: true },
    { label: "Balance on collection", value: formatCents(totals.balanceCents) },
    ...(paidCents ? [{ label: "Deposit received", value: formatCents(paidCents) }] : []),
  ];
  return (
    <dl aria-live={live ? "polite" : undefined} className={cn("divide-y divide-primer-100 text-sm", className)}>
      {rows.map((r) => (
        <div key={r.label} className={cn("flex items-baseline justify-between gap-4 py-1.5", r.strong && "text-base")}>
          <dt className={cn(r.muted ? "text-primer-700" : "text-ink-950", r.strong && "font-semibold")}>{r.label}</dt>
          <dd className={cn("tabular-nums", r.strong ? "font-bold text-ink-950" : "text-ink-950")} data-testid={r.label === "Total" ? "quote-total" : undefined}>
            {r.value}
          </dd>
        </div>
      ))}
    </dl>
  );
}
