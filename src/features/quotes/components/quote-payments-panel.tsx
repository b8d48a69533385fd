import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { CreditCard, TriangleAlert } from "lucide-react";
import { formatCents } from "@shared/quote/index";
import type { PaymentDto } from "@shared/schemas/payment.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { FormActions } from "@/components/ui/form/form-actions";
import { MoneyField } from "@/components/ui/form/money-field";
import { TextField } from "@/components/ui/form/text-field";
import { Panel } from "@/components/ui/panel";
import { toast } from "@/components/ui/toast/toast-store";
import { formatDateTime } from "@/utils/format-date";
import { quoteQueries, useAcceptPayment, useRefundPayment } from "../api/quotes.queries";

const STATUS_TEXT: Record<PaymentDto["status"], string> = { paid: "Paid", partially_refunded: "Partly refunded", refunded: "Refunded" };

/** Deposits received for a quote (recorded from the payment provider's webhook), with refunds; the owner acts on them. */
export function QuotePaymentsPanel({ quoteId, isOwner }: { quoteId: number; isOwner: boolean }) {
  const { data, isPending } = useQuery(quoteQueries.payments(quoteId));
  const [refunding, setRefunding] = useState<PaymentDto | null>(null);
  const accept = useAcceptPayment(quoteId);
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
                <span className="text-sm font-semibold text-ink-900">{STATUS_TEXT[p.status]}</span>
              </div>
              <p className="text-sm text-primer-700">
                Card payment for version {p.version} · {formatDateTime(p.paidAt)}
              </p>
              <p className="truncate text-xs text-primer-600" title={p.providerPaymentId}>
                Reference {p.providerPaymentId}
              </p>
              {p.flagged && !p.reviewedAt ? (
                <Alert tone="warning" title="Check this payment" className="mt-3">
                  <p>{p.flagReason}. The job was not booked automatically.</p>
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
                          toast.success("Payment accepted; the job is booked");
                        } catch (e) {
                          toast.error(isApiError(e) ? e.message : "Could not accept the payment");
                        }
                      }}
                    >
                      Accept payment and book the job
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
      {refunding ? <RefundDialog quoteId={quoteId} payment={refunding} onClose={() => setRefunding(null)} /> : null}
    </Panel>
  );
}

function RefundDialog({ quoteId, payment, onClose }: { quoteId: number; payment: PaymentDto; onClose: () => void }) {
  const left = payment.amountCents - payment.refundedCents;
  const [amount, setAmount] = useState<number | string | null>(left);
  const [reason, setReason] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const refund = useRefundPayment(quoteId);
  const amountError = typeof amount !== "number" ? "Enter an amount" : amount <= 0 ? "More than $0.00" : amount > left ? `At most ${formatCents(left)}` : undefined;
  return (
    <Dialog title="Refund a deposit" description={`Up to ${formatCents(left)} can go back to the customer's card.`} onClose={onClose}>
      <form
        noValidate
        className="flex flex-col gap-5"
        onSubmit={async (e) => {
          e.preventDefault();
          if (amountError) return;
          setProblem(null);
          try {
            const res = await refund.mutateAsync({ paymentId: payment.id, amountCents: amount as number, reason: reason || null });
            toast.success(res.message);
            onClose();
          } catch (err) {
            setProblem(isApiError(err) ? err.message : "The refund could not be made.");
          }
        }}
      >
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <MoneyField label="Amount to refund" required value={amount} onChange={setAmount} error={amount !== left ? amountError : undefined} />
        <TextField label="Reason (optional)" value={reason} onChange={(e) => setReason(e.target.value)} maxLength={500} />
        <FormActions>
          <Button type="submit" variant="danger" size="lg" pending={refund.isPending} disabled={Boolean(amountError)}>
            Refund {typeof amount === "number" ? formatCents(amount) : ""}
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Cancel
          </Button>
        </FormActions>
      </form>
    </Dialog>
  );
}
