import { Link, useParams, useSearchParams } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { LinkIcon } from "lucide-react";
import type { Stage } from "@shared/domain/stages";
import { isApiError } from "@/lib/api-client";
import { Brand } from "@/components/ui/brand";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Spinner } from "@/components/ui/spinner";
import { SkipLink } from "@/components/layouts/skip-link";
import { paths } from "@/config/paths";
import { StageBadge } from "@/features/jobs/components/stage-badge";
import { portalQueries } from "@/features/portal/api/portal.queries";
import { PortalJobDetails } from "@/features/portal/components/portal-job-details";
import { PortalQuoteView } from "@/features/portal/components/portal-quote-view";
import { PortalColourChoice } from "@/features/portal/components/portal-colour-choice";
import { PortalChangeOrder } from "@/features/change-orders/components/portal-change-order";

/**
 * A quote opened from the link in the shop's e-mail: no sign-in, no navigation, just that quote and its job.
 * The link itself is the key (signed by the server, with an expiry); every request carries it.
 */
export default function QuoteLinkRoute() {
  const { token = "" } = useParams();
  const [search] = useSearchParams();
  const returnState = search.get("paid") ? "paid" : search.get("cancelled") ? "cancelled" : null;
  const session = useQuery(portalQueries.session(token));
  const quoteId = session.data?.quoteId ?? 0;
  const quote = useQuery({ ...portalQueries.quote(quoteId, token, { waitForPayment: returnState === "paid" }), enabled: quoteId > 0 });
  const job = useQuery({ ...portalQueries.job(quote.data?.jobId ?? 0, token), enabled: Boolean(quote.data) });
  const error = session.error ?? quote.error;
  // The change-order e-mail opens the change above the quote it amends.
  const changeId = Number(search.get("change") ?? 0);

  return (
    <div className="min-h-dvh">
      <SkipLink />
      <header className="on-dark bg-ink-950 text-white">
        <div className="mx-auto flex h-14 max-w-3xl items-center justify-between gap-3 px-4">
          <Brand />
          <Link to={paths.signIn} className="inline-flex min-h-11 items-center rounded-lg px-3 text-sm font-semibold text-ink-100 ring-1 ring-white/20 hover:bg-white/10 hover:text-white">
            Sign in
          </Link>
        </div>
      </header>
      <main id="main" tabIndex={-1} className="mx-auto max-w-3xl px-4 py-6 outline-none">
        {error ? (
          <EmptyState
            icon={<LinkIcon aria-hidden />}
            title={isApiError(error) && error.status === 401 ? "This link has expired or is not valid" : "This quote could not be opened"}
            action={<ButtonLink to={paths.signIn}>Sign in instead</ButtonLink>}
          >
            {isApiError(error) ? error.message : "Try again in a moment."}
          </EmptyState>
        ) : !quote.data ? (
          <Spinner label="Opening your quote…" />
        ) : (
          <div className="flex flex-col gap-8">
            <title>{`Quote #${quote.data.id} · ${quote.data.jobTitle} · Coatwright`}</title>
            <p className="text-sm text-primer-700">Hello {session.data?.customerName.split(" ")[0]}. This page is just for you; please do not share the link.</p>
            {changeId > 0 ? <PortalChangeOrder id={changeId} token={token} returnState={returnState} /> : null}
            {search.get("colour") ? <PortalColourChoice jobId={quote.data.jobId} token={token} /> : null}
            <PortalQuoteView quote={quote.data} token={token} returnState={returnState} />
            {search.get("colour") ? null : <PortalColourChoice jobId={quote.data.jobId} token={token} />}
            {job.data ? (
              <section aria-labelledby="job-heading" className="flex flex-col gap-4 border-t border-primer-200 pt-6">
                <div className="flex flex-wrap items-center justify-between gap-3">
                  <h2 id="job-heading" className="text-xl font-bold text-ink-950">
                    Your job in the shop
                  </h2>
                  <StageBadge stage={job.data.stage as Stage} size="lg" />
                </div>
                <PortalJobDetails job={{ ...job.data, finishText: null, quotes: [] }} linkQuotes={false} />
              </section>
            ) : null}
          </div>
        )}
      </main>
    </div>
  );
}
