import { Link, useNavigate } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { Plus, ReceiptText } from "lucide-react";
import { formatCents } from "@shared/quote/index";
import { isApiError } from "@/lib/api-client";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Panel } from "@/components/ui/panel";
import { toast } from "@/components/ui/toast/toast-store";
import { formatDate } from "@/utils/format-date";
import { paths } from "@/config/paths";
import { quoteQueries, useCreateQuote } from "../api/quotes.queries";
import { QuoteStatusBadge } from "./quote-status-badge";

/** The job's quotes with their status and money, and a way to start one (office only). */
export function JobQuotesPanel({ jobId, canCreate }: { jobId: number; canCreate: boolean }) {
  const { data, isPending } = useQuery(quoteQueries.list({ jobId, pageSize: 50, sort: "-updatedAt" }));
  const create = useCreateQuote();
  const navigate = useNavigate();
  const items = data?.items ?? [];
  const newQuote = canCreate ? (
    <Button
      variant="secondary"
      icon={<Plus aria-hidden className="size-4" />}
      pending={create.isPending}
      onClick={async () => {
        try {
          const q = await create.mutateAsync(jobId);
          navigate(paths.quote(q.id));
        } catch (e) {
          toast.error(isApiError(e) ? e.message : "Could not start a quote");
        }
      }}
    >
      New quote
    </Button>
  ) : null;
  return (
    <Panel title="Quotes" titleId="job-quotes-heading" actions={items.length ? newQuote : null}>
      {isPending ? (
        <p className="text-sm text-primer-700">Loading quotes…</p>
      ) : items.length === 0 ? (
        <EmptyState icon={<ReceiptText aria-hidden />} title="No quote yet" action={newQuote} className="border-0 py-4">
          Labour comes from the shop rate and materials from the finish plan's estimate.
        </EmptyState>
      ) : (
        <ul className="divide-y divide-primer-100">
          {items.map((q) => (
            <li key={q.id} className="flex flex-wrap items-center justify-between gap-3 py-2">
              <div className="min-w-0">
                <Link to={paths.quote(q.id)} className="font-semibold text-ink-950 hover:text-candy-700 hover:underline">
                  Quote #{q.id}
                </Link>
                <span className="ml-2 text-sm text-primer-700">v{q.version} · valid until {formatDate(q.validUntil)}</span>
              </div>
              <div className="flex items-center gap-3 text-sm">
                <span className="tabular-nums font-semibold">{formatCents(q.totalCents)}</span>
                {q.paidCents > 0 ? <span className="text-emerald-800">deposit {formatCents(q.paidCents)} paid</span> : null}
                <QuoteStatusBadge status={q.status} />
              </div>
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}
