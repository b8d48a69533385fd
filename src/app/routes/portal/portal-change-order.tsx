import { useSearchParams } from "react-router";
import { PageHeader } from "@/components/ui/page-header";
import { useIdParam } from "@/hooks/use-id-param";
import { PortalChangeOrder } from "@/features/change-orders/components/portal-change-order";
import { InPageNotFound } from "../in-page-not-found";
import { paths } from "@/config/paths";

/** A change order for the signed-in customer (the e-mail's link opens it through the quote link instead). */
export default function PortalChangeOrderRoute() {
  const { id, valid } = useIdParam("changeOrderId");
  const [search] = useSearchParams();
  if (!valid) return <InPageNotFound what="Change order" backTo={paths.portal} backLabel="Back to my jobs" />;
  const returnState = search.get("paid") ? "paid" : search.get("cancelled") ? "cancelled" : null;
  return (
    <>
      <PageHeader documentTitle={`Change order #${id}`} eyebrow="A change to your job" title={`Change order #${id}`} />
      <div className="mx-auto flex max-w-3xl flex-col gap-6">
        <PortalChangeOrder id={id} returnState={returnState} />
      </div>
    </>
  );
}
