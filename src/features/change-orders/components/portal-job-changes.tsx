import { Link } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { CHANGE_ORDER_STATUS_LABELS } from "@shared/domain/change-orders";
import { portalChangeOrderQueries } from "../api/portal-change-orders.queries";

/** Links to the job's change orders for the customer; renders nothing when there are none. */
export function PortalJobChanges({ jobId, hrefOf }: { jobId: number; hrefOf: (id: number) => string }) {
  const list = useQuery(portalChangeOrderQueries.job(jobId));
  const items = list.data?.items ?? [];
  if (!items.length) return null;
  return (
    <section aria-labelledby="portal-changes-heading" className="flex flex-col gap-2">
      <h2 id="portal-changes-heading" className="text-lg font-semibold text-ink-950">
        Changes to this job
      </h2>
      <ul className="flex flex-col gap-1">
        {items.map((c) => (
          <li key={c.id}>
            <Link to={hrefOf(c.id)} className="inline-flex min-h-11 items-center font-semibold text-candy-700 underline underline-offset-2">
              Change order #{c.id}: {CHANGE_ORDER_STATUS_LABELS[c.status]}
            </Link>
          </li>
        ))}
      </ul>
    </section>
  );
}
