import { useState } from "react";
import { formatCents } from "@shared/quote/index";
import type { PaymentDto } from "@shared/schemas/payment.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { FormActions } from "@/components/ui/form/form-actions";
import { MoneyField } from "@/components/ui/form/money-field";
import { TextField } from "@/components/ui/form/text-field";
import { toast } from "@/components/ui/toast/toast-store";
import { useRefundPayment } from "../api/payments.queries";

/** Refund all that is left of a payment (the amount it opens with) or part of it, back to the customer's card. */
export function RefundDialog({ payment, onClose, defaultReason = "" }: { payment: PaymentDto; onClose: () => void; defaultReason?: string }) {
  const left = payment.amountCents - payment.refundedCents;
  const [amount, setAmount] = useState<number | string | null>(left);
  const [reason, setReason] = useState(defaultReason);
  const [problem, setProblem] = useState<string | null>(null);
  const refund = useRefundPayment();
  const amountError = typeof amount !== "number" ? "Enter an amount" : amount <= 0 ? "More than $0.00" : amount > left ? `At most ${formatCents(left)}` : undefined;
  return (
    <Dialog title="Refund a payment" description={`Up to ${formatCents(left)} can go back to ${payment.customerName}'s card.`} onClose={onClose}>
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
