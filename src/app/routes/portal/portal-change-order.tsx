import { useParams, useSearchParams } from "react-router";
import { PortalChangeOrder } from "@/features/change-orders/components/portal-change-order";
import { InPageNotFound } from "../in-page-not-found";
import { paths } from "@/config/paths";

/** A change order for the signed-in customer (the e-mail's link opens it through the quote link instead). */
export default function PortalChangeOrderRoute() {
  const { changeOrderId } = useParams();
  const [search] = useSearchParams();
  const id = Number(changeOrderId);
  if (!Number.isInteger(id) || id <= 0) return <InPageNotFound what="Change order" backTo={paths.portal} backLabel="Back to your jobs" />;
  const returnState = search.get("paid") ? "paid" : search.get("cancelled") ? "cancelled" : null;
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6">
      <title>{`Change order #${id} · Coatwright`}</title>
      <PortalChangeOrder id={id} returnState={returnState} />
    </div>
  );
}
