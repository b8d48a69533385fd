import { Link } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { ReceiptText } from "lucide-react";
import { formatCents } from "@shared/quote/index";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { portalQueries } from "@/features/portal/api/portal.queries";
import { CustomerQuoteStatus } from "@/features/portal/components/portal-quote-view";
import { formatDate } from "@/utils/format-date";

export default function MyQuotesRoute() {
  const { data, isPending } = useQuery(portalQueries.quotes());
  const items = data?.items ?? [];
  return (
    <>
      <PageHeader title="My quotes" description="Read a quote, approve it and pay the deposit to book the work." />
      {isPending ? (
        <Spinner label="Loading your quotes…" />
      ) : items.length === 0 ? (
        <EmptyState icon={<ReceiptText aria-hidden />} title="No quotes yet">
          When the shop sends you a quote, it shows up here.
        </EmptyState>
      ) : (
        <ul className="flex flex-col gap-3">
          {items.map((q) => (
            <li key={q.id}>
              <Link to={paths.portalQuote(q.id)} className="block rounded-2xl border border-primer-200 bg-white p-4 shadow-card hover:border-candy-400">
                <p className="text-sm font-medium text-primer-700">Quote #{q.id}</p>
                <p className="text-lg leading-snug font-semibold text-ink-950">{q.jobTitle}</p>
                <div className="mt-2 flex flex-wrap items-center gap-x-3 gap-y-2">
                  <CustomerQuoteStatus status={q.status} />
                  <span className="tabular-nums font-semibold text-ink-950">{formatCents(q.totalCents)}</span>
                  {q.paidCents >= q.depositCents && q.depositCents > 0 ? (
                    <span className="text-sm text-emerald-800">Deposit paid</span>
                  ) : (
                    <span className="text-sm text-primer-700">Valid until {formatDate(q.validUntil)}</span>
                  )}
                </div>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
