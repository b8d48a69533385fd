import { Link } from "react-router";
import { Camera } from "lucide-react";
import { formatCents } from "@shared/quote/index";
import type { PortalJobDto } from "@shared/schemas/quote.schema";
import { paths } from "@/config/paths";
import { formatDateTime } from "@/utils/format-date";
import { CustomerQuoteStatus } from "./portal-quote-view";

/** The finish in words and the progress photos the shop chose to share. */
export function PortalJobDetails({ job, linkQuotes = true }: { job: PortalJobDto; linkQuotes?: boolean }) {
  return (
    <div className="flex flex-col gap-5">
      {job.finishText ? (
        <section aria-labelledby={`finish-${job.id}`} className="rounded-2xl bg-ink-950 p-5 text-white">
          <h2 id={`finish-${job.id}`} className="text-sm font-semibold tracking-wide text-candy-200 uppercase">
            The finish
          </h2>
          <p className="mt-2 text-lg leading-snug">{job.finishText}</p>
        </section>
      ) : null}
      <section aria-labelledby={`photos-${job.id}`}>
        <h2 id={`photos-${job.id}`} className="mb-2 text-lg font-semibold text-ink-950">
          Photos from the shop
        </h2>
        {job.photos.length === 0 ? (
          <p className="flex items-center gap-2 text-sm text-primer-700">
            <Camera aria-hidden className="size-4" /> No photos yet. The shop adds them as the work goes on.
          </p>
        ) : (
          <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
            {job.photos.map((p) => (
              <li key={p.id}>
                <a href={p.url} target="_blank" rel="noreferrer" className="block overflow-hidden rounded-xl border border-primer-200 bg-white">
                  <img src={p.thumbUrl} alt={p.caption ?? `Photo of your job, ${formatDateTime(p.takenAt)}`} loading="lazy" className="aspect-square w-full object-cover" />
                  <span className="block px-2 py-1.5 text-xs text-primer-700">{p.caption ?? formatDateTime(p.takenAt)}</span>
                </a>
              </li>
            ))}
          </ul>
        )}
      </section>
      {job.quotes.length ? (
        <section aria-labelledby={`quotes-${job.id}`}>
          <h2 id={`quotes-${job.id}`} className="mb-2 text-lg font-semibold text-ink-950">
            Quotes
          </h2>
          <ul className="divide-y divide-primer-100 rounded-xl border border-primer-200 bg-white">
            {job.quotes.map((q) => (
              <li key={q.id} className="flex flex-wrap items-center justify-between gap-3 px-4 py-3">
                {linkQuotes ? (
                  <Link to={paths.portalQuote(q.id)} className="font-semibold text-ink-950 underline-offset-2 hover:underline">
                    Quote #{q.id}: {formatCents(q.totalCents)}
                  </Link>
                ) : (
                  <span className="font-semibold text-ink-950">
                    Quote #{q.id}: {formatCents(q.totalCents)}
                  </span>
                )}
                <span className="flex items-center gap-2 text-sm">
                  {q.paidCents > 0 ? <span className="text-emerald-800">Deposit {formatCents(q.paidCents)} paid</span> : null}
                  <CustomerQuoteStatus status={q.status} />
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
