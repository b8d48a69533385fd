import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { formatCents } from "@shared/quote/index";
import type { QuoteDetailDto } from "@shared/schemas/quote.schema";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { Panel } from "@/components/ui/panel";
import { Spinner } from "@/components/ui/spinner";
import { formatDateTime } from "@/utils/format-date";
import { quoteQueries, quotePdfUrl } from "../api/quotes.queries";
import { QuoteStatusBadge } from "./quote-status-badge";
import { QuoteVersionView } from "./quote-view";

/** What happened to the quote on offer: sent, opened, answered, and every version with a way to read it. */
export function QuoteHistory({ quote }: { quote: QuoteDetailDto }) {
  const [open, setOpen] = useState<number | null>(null);
  const v = quote.current;
  const events: { label: string; at: string | null; detail?: string }[] = [
    { label: `Version ${v.version} started`, at: v.createdAt, detail: v.createdByName ? `by ${v.createdByName}` : undefined },
    { label: "Sent", at: v.sentAt, detail: v.sentTo ? `to ${v.sentTo}` : undefined },
    { label: "Opened by the customer", at: v.viewedAt },
    {
      label: v.status === "declined" ? "Declined" : "Approved",
      at: v.decidedAt,
      detail: v.decidedAt
        ? [v.decisionName && `by ${v.decisionName}`, v.decidedVia === "link" ? "from the e-mail link" : "signed in", v.decidedAddress && `from ${v.decidedAddress}`, v.decisionNote && `“${v.decisionNote}”`]
            .filter(Boolean)
            .join(", ")
        : undefined,
    },
  ].filter((e) => e.at);
  return (
    <Panel title="History" titleId="quote-history-heading">
      <ol className="flex flex-col gap-3 border-l-2 border-primer-200 pl-4">
        {events.map((e) => (
          <li key={e.label}>
            <p className="text-sm font-semibold text-ink-950">{e.label}</p>
            <p className="text-sm text-primer-700">
              <time dateTime={e.at!}>{formatDateTime(e.at)}</time>
              {e.detail ? ` · ${e.detail}` : ""}
            </p>
          </li>
        ))}
      </ol>
      {quote.versions.length > 1 ? (
        <>
          <h3 className="mt-5 mb-2 text-sm font-semibold text-ink-950">Versions</h3>
          <ul className="divide-y divide-primer-100 rounded-lg border border-primer-200">
            {quote.versions.map((s) => (
              <li key={s.version} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2 text-sm">
                <span className="flex items-center gap-2">
                  <span className="font-semibold">v{s.version}</span>
                  <QuoteStatusBadge status={s.status} />
                  {s.supersededAt ? <span className="text-xs text-primer-700">replaced</span> : null}
                </span>
                <span className="flex items-center gap-2">
                  <span className="tabular-nums">{formatCents(s.totalCents)}</span>
                  {s.version !== quote.version ? (
                    <Button variant="ghost" size="sm" onClick={() => setOpen(s.version)} aria-label={`Read version ${s.version}`}>
                      Read
                    </Button>
                  ) : null}
                </span>
              </li>
            ))}
          </ul>
        </>
      ) : null}
      {open ? <VersionDialog quoteId={quote.id} version={open} onClose={() => setOpen(null)} /> : null}
    </Panel>
  );
}

function VersionDialog({ quoteId, version, onClose }: { quoteId: number; version: number; onClose: () => void }) {
  const { data } = useQuery(quoteQueries.version(quoteId, version));
  return (
    <Dialog title={`Quote #${quoteId}, version ${version}`} description="As it was; this version no longer changes." onClose={onClose} size="lg">
      {data ? (
        <>
          <QuoteVersionView compact version={data} headingId={`old-version-${version}`} />
          <a href={quotePdfUrl(quoteId, version)} target="_blank" rel="noreferrer" className="mt-4 inline-block text-sm font-semibold text-candy-700 underline">
            Open the PDF of version {version}
          </a>
        </>
      ) : (
        <Spinner />
      )}
    </Dialog>
  );
}
