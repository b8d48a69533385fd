import { customerLineDetail, formatCents, formatPercent, QUOTE_LINE_KIND_LABELS } from "@shared/quote/index";
import type { QuoteVersionDto } from "@shared/schemas/quote.schema";
import { Panel } from "@/components/ui/panel";
import { formatDate } from "@/utils/format-date";
import { QuoteTotalsList } from "./quote-totals";

/** A sent (or older) version as the office reads it: every line with how it was reached, and the totals. */
export function QuoteVersionView({
  version,
  paidCents,
  headingId = "quote-version-heading",
  compact = false,
}: {
  version: QuoteVersionDto;
  paidCents?: number;
  headingId?: string;
  /** One column (inside a dialog). */
  compact?: boolean;
}) {
  return (
    <div className={compact ? "flex flex-col gap-6" : "grid gap-6 xl:grid-cols-[minmax(0,1fr)_22rem]"}>
      <div className="flex min-w-0 flex-col gap-6">
        <Panel title={`Version ${version.version}`} titleId={headingId} flush>
          <div className="overflow-x-auto">
            <table className="w-full min-w-[36rem] text-left text-sm" aria-labelledby={headingId}>
              <thead className="bg-primer-100">
                <tr>
                  <th scope="col" className="px-4 py-2 font-semibold">Line</th>
                  <th scope="col" className="px-4 py-2 font-semibold">Worked out</th>
                  <th scope="col" className="px-4 py-2 text-right font-semibold">Amount</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-primer-100">
                {version.lines.map((line, i) => (
                  <tr key={i}>
                    <th scope="row" className="px-4 py-2 font-medium text-ink-950">
                      <span className="block">{line.description}</span>
                      <span className="text-xs font-normal text-primer-700">
                        {QUOTE_LINE_KIND_LABELS[line.kind]}
                        {version.totals.lines[i]?.taxed ? " · taxed" : ""}
                      </span>
                    </th>
                    <td className="px-4 py-2 text-primer-700">
                      {line.kind === "materials"
                        ? `Cost ${formatCents(line.costCents ?? 0)} + ${formatPercent(line.markupPercent ?? 0)} markup`
                        : (customerLineDetail(line) ?? "Fixed amount")}
                    </td>
                    <td className="px-4 py-2 text-right tabular-nums text-ink-950">{formatCents(version.totals.lines[i]?.amountCents ?? 0)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </Panel>
        <Panel title="For the customer" titleId={`${headingId}-words`}>
          <dl className="flex flex-col gap-4 text-sm">
            <div>
              <dt className="font-semibold text-ink-950">The finish</dt>
              <dd className="mt-1 text-ink-900">{version.finishText || <span className="text-primer-700">Not described</span>}</dd>
            </div>
            {version.intro ? (
              <div>
                <dt className="font-semibold text-ink-950">Message</dt>
                <dd className="mt-1 whitespace-pre-line text-ink-900">{version.intro}</dd>
              </div>
            ) : null}
            {version.terms ? (
              <div>
                <dt className="font-semibold text-ink-950">Terms</dt>
                <dd className="mt-1 whitespace-pre-line text-ink-900">{version.terms}</dd>
              </div>
            ) : null}
            <div>
              <dt className="font-semibold text-ink-950">Valid until</dt>
              <dd className="mt-1 text-ink-900">{formatDate(version.validUntil)}</dd>
            </div>
          </dl>
        </Panel>
      </div>
      <Panel title="Totals" titleId={`${headingId}-totals`} className="self-start">
        <QuoteTotalsList totals={version.totals} taxPercent={version.taxPercent} taxedKinds={version.taxedKinds} depositPercent={version.depositPercent} paidCents={paidCents} />
      </Panel>
    </div>
  );
}
