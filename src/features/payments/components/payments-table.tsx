import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "react-router";
import { CreditCard } from "lucide-react";
import type { PaymentDto } from "@shared/schemas/payment.schema";
import { isApiError } from "@/lib/api-client";
import { SingleChoice } from "@/components/ui/choice-group";
import { DataTable } from "@/components/ui/data-table/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { paymentQueries, useAcceptPayment } from "../api/payments.queries";
import { paymentColumns } from "./payment-columns";
import { RefundDialog } from "./refund-dialog";

type Show = "all" | "to-check";

/** A flagged payment's reason ("paid $1.00 but …") as the refund's reason, starting with a capital. */
const upperFirst = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/**
 * Every card payment, those waiting for the owner first (flagged: an amount that does not match, or more than was
 * still due); `?show=to-check` lists only those. A refund is one dialog away, opened with all that is left.
 */
export function PaymentsTable() {
  const [searchParams, setSearchParams] = useSearchParams();
  const show: Show = searchParams.get("show") === "to-check" ? "to-check" : "all";
  const list = useQuery(paymentQueries.list(show === "to-check" ? { flagged: "1" } : {}));
  const toCheck = useQuery(paymentQueries.list({ flagged: "1" }));
  const [refunding, setRefunding] = useState<PaymentDto | null>(null);
  const accept = useAcceptPayment();
  const columns = paymentColumns({
    onRefund: setRefunding,
    accepting: accept.isPending ? (accept.variables?.paymentId ?? null) : null,
    onAccept: async (p) => {
      try {
        await accept.mutateAsync({ paymentId: p.id });
        toast.success(`Payment #${p.id} accepted: it counts towards the deposit`);
      } catch (e) {
        toast.error(isApiError(e) ? e.message : "Could not accept the payment");
      }
    },
  });
  const waiting = toCheck.data?.items.length;
  return (
    <>
      <SingleChoice<Show>
        label="Show"
        className="mb-4"
        value={show}
        onChange={(v) => setSearchParams(v === "all" ? {} : { show: v }, { replace: true })}
        options={[
          { value: "all", label: "All payments" },
          { value: "to-check", label: waiting === undefined ? "To check" : `To check (${waiting})` },
        ]}
      />
      {list.isPending ? (
        <Spinner label="Loading payments…" />
      ) : list.error && !list.data ? (
        <p role="alert" className="text-red-800">
          {list.error.message}
        </p>
      ) : (
        <DataTable
          label={show === "to-check" ? "Payments to check" : "Payments"}
          columns={columns}
          data={list.data?.items ?? []}
          getRowId={(p) => String(p.id)}
          minWidthClassName="min-w-[56rem]"
          empty={
            <EmptyState icon={<CreditCard aria-hidden />} title={show === "to-check" ? "No payment to check" : "No payments yet"} className="border-0">
              {show === "to-check" ? "Every payment matches what was due." : "Deposits appear here when the card provider confirms them."}
            </EmptyState>
          }
        />
      )}
      {refunding ? (
        <RefundDialog payment={refunding} onClose={() => setRefunding(null)} defaultReason={refunding.needsReview ? upperFirst(refunding.flagReason ?? "") : ""} />
      ) : null}
    </>
  );
}
