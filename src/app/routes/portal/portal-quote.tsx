import { useSearchParams } from "react-router";
import { useIdParam } from "@/hooks/use-id-param";
import { useQuery } from "@tanstack/react-query";
import { isApiError } from "@/lib/api-client";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { portalQueries } from "@/features/portal/api/portal.queries";
import { PortalQuoteView } from "@/features/portal/components/portal-quote-view";
import { InPageNotFound } from "../in-page-not-found";

export default function PortalQuoteRoute() {
  const { id, valid } = useIdParam("quoteId");
  const [search] = useSearchParams();
  const returnState = search.get("paid") ? "paid" : search.get("cancelled") ? "cancelled" : null;
  const { data, error, isPending } = useQuery({ ...portalQueries.quote(id, null, { waitForPayment: returnState === "paid" }), enabled: valid });
  if (!valid || (isApiError(error) && (error.status === 404 || error.status === 400)))
    return <InPageNotFound what="Quote" backTo={paths.portalQuotes} backLabel="Back to my quotes" />;
  if (isPending || !data) return <Spinner label="Loading your quote…" />;
  return (
    <>
      <title>{`Quote #${data.id} · ${data.jobTitle} · Coatwright`}</title>
      <PortalQuoteView quote={data} returnState={returnState} />
    </>
  );
}
