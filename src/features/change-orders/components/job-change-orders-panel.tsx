import { useQuery } from "@tanstack/react-query";
import { Panel } from "@/components/ui/panel";
import { formatDateTime } from "@/utils/format-date";
import { changeOrderQueries } from "../api/change-orders.queries";
import { ChangeOrderDraftForm } from "./change-order-draft-form";
import { ChangeOrderHead, ChangeOrderLayers, ChangeOrderMoney } from "./change-order-view";

/**
 * A job's change orders: what changed (words and layers side by side), the price difference for the office, and the
 * customer's answer. The office edits and sends a draft here. Renders nothing when the job has none.
 */
export function JobChangeOrdersPanel({ jobId, canEdit, labourRateCents }: { jobId: number; canEdit: boolean; labourRateCents: number }) {
  const list = useQuery(changeOrderQueries.job(jobId));
  const items = list.data?.items ?? [];
  if (!items.length) return null;
  return (
    <Panel title="Change orders" titleId="change-orders-heading">
      <ul className="flex flex-col gap-6">
        {items.map((co) => (
          <li key={co.id} className="flex flex-col gap-3">
            <ChangeOrderHead co={co} />
            <ChangeOrderLayers co={co} />
            <ChangeOrderMoney co={co} />
            {co.sentAt ? <p className="text-xs text-primer-700">Sent {formatDateTime(co.sentAt)}{co.sentTo ? ` to ${co.sentTo}` : ""}</p> : null}
            {co.decidedAt ? (
              <p className="text-xs text-primer-700">
                {co.status === "approved" ? "Approved" : "Declined"} by {co.decisionName} {formatDateTime(co.decidedAt)}
                {co.decidedAddress ? ` from ${co.decidedAddress}` : ""}
                {co.decisionNote ? `: “${co.decisionNote}”` : ""}
              </p>
            ) : null}
            {canEdit && co.status === "draft" ? <ChangeOrderDraftForm key={labourRateCents} co={co} labourRateCents={labourRateCents} /> : null}
          </li>
        ))}
      </ul>
    </Panel>
  );
}
