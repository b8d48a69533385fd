import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { CreditCard, TriangleAlert } from "lucide-react";
import { formatCents } from "@shared/quote/index";
import type { PaymentDto } from "@shared/schemas/payment.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { toast } from "@/components/ui/toast/toast-store";
import { formatDateTime } from "@/utils/format-date";
import { paymentQueries, useAcceptPayment } from "@/features/payments/api/payments.queries";
import { RefundDialog } from "@/features/payments/components/refund-dialog";
import { PAYMENT_STATUS_TEXT } from "@/features/payments/components/payment-status";


/** Deposits received for a quote (recorded from the payment provider's webhook), with refunds; the owner acts on them. */
export function QuotePaymentsPanel({ quoteId, isOwner }: { quoteId: number; isOwner: boolean }) {
  const { data, isPending } = useQuery(paymentQueries.list({ quoteId }));
  const [refunding, setRefunding] = useState<PaymentDto | null>(null);
  const accept = useAcceptPayment();
  const items = data?.items ?? [];
  return (
    <Panel title="Payments" titleId="quote-payments-heading">
      {isPending ? (
        <p className="text-sm text-primer-700">Loading payments…</p>
      ) : items.length === 0 ? (
        <p className="flex items-center gap-2 text-sm text-primer-700">
          <CreditCard aria-hidden className="size-4" /> No deposit received yet. Payments appear here when the card provider confirms them.
        </p>
      ) : (
        <ul className="flex flex-col gap-4">
          {items.map((p) => (
            <li key={p.id} className="rounded-lg border border-primer-200 p-3">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <span className="text-base font-semibold tabular-nums text-ink-950">{formatCents(p.amountCents)}</span>
                <span className="text-sm font-semibold text-ink-900">{PAYMENT_STATUS_TEXT[p.status]}</span>
              </div>
              <p className="text-sm text-primer-700">
                Card payment for version {p.version} · {formatDateTime(p.paidAt)}
              </p>
              <p className="truncate text-xs text-primer-600" title={p.providerPaymentId}>
                Reference {p.providerPaymentId}
              </p>
              {p.needsReview ? (
                <Alert tone="warning" title="Check this payment" className="mt-3">
                  <p>{p.flagReason}. It does not count towards the deposit until it is accepted; refund it if it was not due.</p>
                  {isOwner ? (
                    <Button
                      className="mt-2"
                      variant="secondary"
                      size="sm"
                      pending={accept.isPending}
                      icon={<TriangleAlert aria-hidden className="size-4" />}
                      onClick={async () => {
                        try {
                          await accept.mutateAsync({ paymentId: p.id });
                          toast.success("Payment accepted: it counts towards the deposit");
                        } catch (e) {
                          toast.error(isApiError(e) ? e.message : "Could not accept the payment");
                        }
                      }}
                    >
                      Accept payment
                    </Button>
                  ) : null}
                </Alert>
              ) : null}
              {p.refunds.length ? (
                <ul className="mt-2 text-sm text-ink-900">
                  {p.refunds.map((r) => (
                    <li key={r.id}>
                      Refunded {formatCents(r.amountCents)} on {formatDateTime(r.at)}
                      {r.reason ? ` (${r.reason})` : ""}
                    </li>
                  ))}
                </ul>
              ) : null}
              {isOwner && p.refundedCents < p.amountCents ? (
                <Button className="mt-3" variant="secondary" size="sm" onClick={() => setRefunding(p)}>
                  Refund…
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
      {refunding ? <RefundDialog payment={refunding} onClose={() => setRefunding(null)} /> : null}
    </Panel>
  );
}
