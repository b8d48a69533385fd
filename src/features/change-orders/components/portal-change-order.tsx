import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { CreditCard } from "lucide-react";
import { approveQuoteInputSchema } from "@shared/schemas/quote.schema";
import { formatCents } from "@shared/quote/index";
import type { ChangeOrderDto } from "@shared/schemas/change-order.schema";
import { isApiError } from "@/lib/api-client";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Spinner } from "@/components/ui/spinner";
import { TextField } from "@/components/ui/form/text-field";
import { formatDateTime } from "@/utils/format-date";
import { portalChangeOrderQueries, useChangeOrderCheckout, useDecideChangeOrder } from "../api/portal-change-orders.queries";
import { ChangeOrderHead, ChangeOrderLayers, ChangeOrderMoney } from "./change-order-view";

type In = z.input<typeof approveQuoteInputSchema>;
type Out = z.output<typeof approveQuoteInputSchema>;

/**
 * A change to the customer's approved job, as they read and answer it: what changes (words and the layers side by
 * side), the price difference, then approve (signed with their name) or decline; an extra deposit is paid by card.
 */
export function PortalChangeOrder({ id, token, returnState }: { id: number; token?: string | null; returnState?: "paid" | "cancelled" | null }) {
  const co = useQuery(portalChangeOrderQueries.detail(id, token, { waitForPayment: returnState === "paid" }));
  if (co.error) return <Alert tone="error">{isApiError(co.error) ? co.error.message : "This change order could not be opened."}</Alert>;
  if (!co.data) return <Spinner label="Opening the change…" />;
  return (
    <section aria-labelledby="change-order-heading" className="flex flex-col gap-4 rounded-2xl border-2 border-amber-500 bg-white p-4 shadow-card sm:p-5">
      <h2 id="change-order-heading" className="text-xl font-bold text-ink-950">
        A change to {co.data.jobTitle}
      </h2>
      <ChangeOrderHead co={co.data} />
      <ChangeOrderLayers co={co.data} />
      <ChangeOrderMoney co={co.data} />
      {co.data.status === "sent" ? <Answer co={co.data} token={token} /> : null}
      {co.data.decidedAt ? (
        <p className="text-sm font-semibold text-ink-950">
          You {co.data.status} this change, {formatDateTime(co.data.decidedAt)}.{co.data.status === "declined" ? " We carry on as you approved before." : ""}
        </p>
      ) : null}
      {returnState === "paid" && co.data.money && co.data.money.paidCents < co.data.money.depositCents ? <Spinner label="Waiting for the card provider to confirm the payment…" /> : null}
      {co.data.money && co.data.money.depositCents > 0 && co.data.money.paidCents >= co.data.money.depositCents ? (
        <Alert tone="success" title="Extra deposit paid">
          {formatCents(co.data.money.paidCents)} received. Thank you!
        </Alert>
      ) : null}
      {co.data.canPay ? <PayExtra co={co.data} token={token} /> : null}
    </section>
  );
}

function Answer({ co, token }: { co: ChangeOrderDto; token?: string | null }) {
  const decide = useDecideChangeOrder(co.id, token);
  const [problem, setProblem] = useState<string | null>(null);
  const [reason, setReason] = useState("");
  const { register, handleSubmit, setError, formState } = useForm<In, unknown, Out>({ resolver: zodResolver(approveQuoteInputSchema), defaultValues: { name: "", note: "" } });
  return (
    <div className="flex flex-col gap-3 border-t border-primer-200 pt-4">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <form
        aria-label="Approve the change"
        className="flex flex-col gap-3"
        onSubmit={handleSubmit(async (v) => {
          setProblem(null);
          try {
            await decide.mutateAsync({ decision: "approve", ...v });
          } catch (e) {
            setProblem(applyServerErrors(e, setError, ["name", "note"]));
          }
        })}
      >
        <TextField label="Your name (as your signature)" required autoComplete="name" error={formState.errors.name?.message} {...register("name")} />
        <Button type="submit" size="lg" pending={decide.isPending}>
          Approve the change
        </Button>
      </form>
      <div className="flex flex-col gap-2 sm:flex-row sm:items-end">
        <TextField label="Reason (optional)" fieldClassName="flex-1" value={reason} onChange={(e) => setReason(e.target.value)} />
        <Button
          variant="secondary"
          pending={decide.isPending}
          onClick={async () => {
            setProblem(null);
            try {
              await decide.mutateAsync({ decision: "decline", reason });
            } catch (e) {
              setProblem(isApiError(e) ? e.message : "Your answer could not be sent. Try again.");
            }
          }}
        >
          Decline the change
        </Button>
      </div>
    </div>
  );
}

function PayExtra({ co, token }: { co: ChangeOrderDto; token?: string | null }) {
  const checkout = useChangeOrderCheckout(co.id, token);
  const [problem, setProblem] = useState<string | null>(null);
  const due = co.money!.depositCents - co.money!.paidCents;
  return (
    <div className="flex flex-col gap-2 border-t border-primer-200 pt-4">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <Button
        size="lg"
        block
        pending={checkout.isPending}
        icon={<CreditCard aria-hidden className="size-5" />}
        onClick={async () => {
          setProblem(null);
          try {
            const { url } = await checkout.mutateAsync();
            window.location.assign(url);
          } catch (e) {
            setProblem(isApiError(e) ? e.message : "The payment page could not be opened. Try again in a moment.");
          }
        }}
      >
        Pay extra deposit {formatCents(due)}
      </Button>
    </div>
  );
}
