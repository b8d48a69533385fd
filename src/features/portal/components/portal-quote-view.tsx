import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { CircleCheck, CreditCard, FileText, LoaderCircle } from "lucide-react";
import { formatCents, formatPercent } from "@shared/quote/index";
import { SUBSTRATE_LABELS, type Substrate } from "@shared/domain/substrates";
import { approveQuoteInputSchema, declineQuoteInputSchema, type PortalQuoteDto, type QuoteStatus } from "@shared/schemas/quote.schema";
import { isApiError } from "@/lib/api-client";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button, buttonClasses } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { FormActions } from "@/components/ui/form/form-actions";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { cn } from "@/utils/cn";
import { formatDate, formatDateTime } from "@/utils/format-date";
import { PortalInspection } from "./portal-inspection";
import { portalPdfUrl, useApproveQuote, useDeclineQuote, useStartCheckout } from "../api/portal.queries";

/** Status words for the customer. */
export const CUSTOMER_QUOTE_STATUS: Record<QuoteStatus, { text: string; tone: string }> = {
  draft: { text: "Being prepared", tone: "bg-primer-100 text-primer-800 ring-primer-300" },
  sent: { text: "Waiting for your answer", tone: "bg-sky-50 text-sky-900 ring-sky-300" },
  viewed: { text: "Waiting for your answer", tone: "bg-sky-50 text-sky-900 ring-sky-300" },
  approved: { text: "Approved", tone: "bg-emerald-50 text-emerald-900 ring-emerald-300" },
  declined: { text: "Declined", tone: "bg-primer-100 text-primer-800 ring-primer-300" },
  expired: { text: "Expired", tone: "bg-flake-50 text-flake-800 ring-flake-300" },
};

export function CustomerQuoteStatus({ status }: { status: QuoteStatus }) {
  const s = CUSTOMER_QUOTE_STATUS[status];
  return <span className={cn("inline-flex rounded-full px-3 py-1 text-sm font-semibold whitespace-nowrap ring-1 ring-inset", s.tone)}>{s.text}</span>;
}

/**
 * A quote as the customer reads it, phone first: what will be done, what it costs, the deposit, and the one
 * next step (approve, pay the deposit, or nothing to do).
 */
export function PortalQuoteView({
  quote,
  token,
  returnState,
}: {
  quote: PortalQuoteDto;
  /** The signed link from the e-mail, when not signed in. */
  token?: string | null;
  /** Back from the card checkout. */
  returnState?: "paid" | "cancelled" | null;
}) {
  const paid = quote.paidCents >= quote.depositCents && quote.depositCents > 0;
  return (
    <article aria-labelledby="portal-quote-heading" className="flex flex-col gap-5">
      <header className="flex flex-col gap-2">
        <p className="text-sm font-medium text-primer-700">
          {quote.shop.name} · quote #{quote.id}
          {quote.version > 1 ? `, version ${quote.version}` : ""}
        </p>
        <h1 id="portal-quote-heading" className="text-2xl leading-tight font-bold text-ink-950">
          {quote.jobTitle}
        </h1>
        <div className="flex flex-wrap items-center gap-2">
          <CustomerQuoteStatus status={quote.status} />
          <span className="text-sm text-primer-700">Valid until {formatDate(quote.validUntil)}</span>
        </div>
      </header>

      <NextStep quote={quote} token={token} returnState={returnState} paid={paid} />
      {quote.canDecide && !paid ? (
        <p className="rounded-xl bg-white px-4 py-3 text-ink-900 shadow-card">
          Total <strong className="tabular-nums">{formatCents(quote.totalCents)}</strong>, deposit <strong className="tabular-nums">{formatCents(quote.depositCents)}</strong> to book the
          work. <a href="#decide-heading" className="font-semibold text-candy-700 underline">Approve or decline below</a>.
        </p>
      ) : null}

      {quote.intro ? <p className="whitespace-pre-line text-ink-900">{quote.intro}</p> : null}

      {quote.finishText ? (
        <section aria-labelledby="finish-heading" className="rounded-2xl bg-ink-950 p-5 text-white">
          <h2 id="finish-heading" className="text-sm font-semibold tracking-wide text-candy-200 uppercase">
            The finish
          </h2>
          <p className="mt-2 text-lg leading-snug">{quote.finishText}</p>
        </section>
      ) : null}

      {quote.items.length ? (
        <section aria-labelledby="parts-heading">
          <h2 id="parts-heading" className="mb-2 text-lg font-semibold text-ink-950">
            Parts
          </h2>
          <ul className="divide-y divide-primer-100 rounded-xl border border-primer-200 bg-white">
            {quote.items.map((item, i) => (
              <li key={i} className="flex flex-wrap items-baseline justify-between gap-x-3 px-4 py-2.5 text-sm">
                <span className="font-medium text-ink-950">{item.name}</span>
                <span className="text-primer-700">
                  {SUBSTRATE_LABELS[item.substrate as Substrate] ?? item.substrate} · {Number(item.surfaceArea.toFixed(2))} {item.areaUnit === "ft2" ? "sq ft" : "m²"}
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      {quote.inspection ? <PortalInspection inspection={quote.inspection} /> : null}

      <section aria-labelledby="price-heading">
        <h2 id="price-heading" className="mb-2 text-lg font-semibold text-ink-950">
          What it costs
        </h2>
        <div className="rounded-xl border border-primer-200 bg-white">
          <ul className="divide-y divide-primer-100">
            {quote.lines.map((l, i) => (
              <li key={i} className="flex items-start justify-between gap-4 px-4 py-3">
                <div className="min-w-0">
                  <p className="text-ink-950">{l.description}</p>
                  {l.detail ? <p className="text-sm text-primer-700">{l.detail}</p> : null}
                </div>
                <p className="shrink-0 tabular-nums text-ink-950">{formatCents(l.amountCents)}</p>
              </li>
            ))}
          </ul>
          <dl className="border-t-2 border-primer-200 px-4 py-3 text-sm">
            {quote.discountCents ? <Row label="Discount included" value={`-${formatCents(quote.discountCents)}`} /> : null}
            <Row label="Subtotal" value={formatCents(quote.subtotalCents)} />
            <Row label={quote.taxLabel} value={formatCents(quote.taxCents)} />
            <Row label="Total" value={formatCents(quote.totalCents)} strong />
            <Row label={`Deposit to book the work (${formatPercent(quote.depositPercent)})`} value={formatCents(quote.depositCents)} strong />
            <Row label="Balance due on collection" value={formatCents(quote.balanceCents)} />
            {quote.paidCents ? <Row label="Deposit received" value={formatCents(quote.paidCents)} /> : null}
          </dl>
        </div>
      </section>

      {quote.terms ? (
        <section aria-labelledby="terms-heading">
          <h2 id="terms-heading" className="mb-1 text-lg font-semibold text-ink-950">
            Terms
          </h2>
          <p className="whitespace-pre-line text-sm text-ink-900">{quote.terms}</p>
        </section>
      ) : null}

      {quote.canDecide && !paid && !quote.paymentUnderReview ? <DecisionForm quote={quote} token={token} /> : null}

      <a href={portalPdfUrl(quote.id, token)} target="_blank" rel="noreferrer" className={buttonClasses({ variant: "secondary", size: "lg", block: true })}>
        <FileText aria-hidden className="size-5" />
        Download the quote (PDF)
      </a>
      <p className="text-sm text-primer-700">
        {quote.shop.name}
        {quote.shop.address ? ` · ${quote.shop.address}` : ""}
        {quote.shop.phone ? ` · ${quote.shop.phone}` : ""}
        {quote.shop.email ? ` · ${quote.shop.email}` : ""}
      </p>
    </article>
  );
}

function Row({ label, value, strong }: { label: string; value: string; strong?: boolean }) {
  return (
    <div className={cn("flex items-baseline justify-between gap-4 py-1", strong && "text-base font-bold text-ink-950")}>
      <dt className={strong ? "" : "text-primer-700"}>{label}</dt>
      <dd className="tabular-nums">{value}</dd>
    </div>
  );
}

/** The one thing to do now, at the top where a thumb finds it. */
function NextStep({ quote, token, returnState, paid }: { quote: PortalQuoteDto; token?: string | null; returnState?: "paid" | "cancelled" | null; paid: boolean }) {
  if (paid)
    return (
      <div role="status" className="flex gap-3 rounded-2xl border-2 border-emerald-600 bg-emerald-50 p-4 text-emerald-950">
        <CircleCheck aria-hidden className="size-6 shrink-0" />
        <div>
          <p className="font-semibold">Deposit received: {formatCents(quote.paidCents)}. Thank you!</p>
          <p className="text-sm">Your job is booked. We have e-mailed you a receipt and will keep you posted.</p>
        </div>
      </div>
    );
  if (quote.paymentUnderReview)
    return (
      <Alert tone="warning" title="We are checking your payment">
        A payment arrived that did not match the deposit. The shop will be in touch; there is nothing you need to do.
      </Alert>
    );
  if (returnState === "paid" && quote.status === "approved")
    return (
      <div role="status" className="flex items-center gap-3 rounded-2xl border border-primer-200 bg-white p-4">
        <LoaderCircle aria-hidden className="size-6 animate-spin text-candy-600" />
        <p className="font-medium text-ink-950">Confirming your payment with the card provider…</p>
      </div>
    );
  return (
    <>
      {returnState === "cancelled" ? (
        <Alert tone="info" title="Payment not completed">
          Nothing was charged. You can pay the deposit whenever you are ready.
        </Alert>
      ) : null}
      {quote.status === "approved" && quote.canPay ? <PayDeposit quote={quote} token={token} /> : null}
      {quote.status === "approved" && !quote.canPay ? (
        <Alert tone="success" title={`Approved ${formatDateTime(quote.decidedAt)}`}>
          Thank you. The shop will be in touch about the deposit.
        </Alert>
      ) : null}
      {quote.status === "declined" ? (
        <Alert tone="info" title="You declined this quote">
          Changed your mind? Call or e-mail the shop and they will send a fresh quote.
        </Alert>
      ) : null}
      {quote.status === "expired" ? (
        <Alert tone="warning" title="This quote has expired">
          Prices change over time. Ask the shop for a fresh quote.
        </Alert>
      ) : null}
    </>
  );
}

type ApproveIn = z.input<typeof approveQuoteInputSchema>;
type ApproveOut = z.output<typeof approveQuoteInputSchema>;

function DecisionForm({ quote, token }: { quote: PortalQuoteDto; token?: string | null }) {
  const approve = useApproveQuote(quote.id, token);
  const [declining, setDeclining] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<ApproveIn, unknown, ApproveOut>({ resolver: zodResolver(approveQuoteInputSchema), defaultValues: { name: quote.customerName, note: "" } });
  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await approve.mutateAsync(values);
    } catch (e) {
      setProblem(applyServerErrors(e, setError, ["name", "note"]));
    }
  });
  return (
    <section aria-labelledby="decide-heading" className="rounded-2xl border-2 border-candy-600 bg-white p-4 shadow-card">
      <h2 id="decide-heading" className="text-lg font-semibold text-ink-950">
        Happy to go ahead?
      </h2>
      <p className="mt-1 text-sm text-primer-700">
        Approve the quote of {formatCents(quote.totalCents)}; then you can pay the deposit of {formatCents(quote.depositCents)} by card to book the work.
      </p>
      <form onSubmit={submit} noValidate className="mt-4 flex flex-col gap-4">
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <TextField label="Your name" required hint="Your name here is your signature on the quote." autoComplete="name" error={errors.name?.message} {...register("name")} />
        <TextareaField label="Anything to add? (optional)" rows={2} error={errors.note?.message} {...register("note")} />
        <Button type="submit" size="lg" block pending={isSubmitting}>
          Approve quote
        </Button>
        <Button variant="ghost" size="lg" block onClick={() => setDeclining(true)}>
          Decline
        </Button>
      </form>
      {declining ? <DeclineDialog quote={quote} token={token} onClose={() => setDeclining(false)} /> : null}
    </section>
  );
}

type DeclineIn = z.input<typeof declineQuoteInputSchema>;
type DeclineOut = z.output<typeof declineQuoteInputSchema>;

function DeclineDialog({ quote, token, onClose }: { quote: PortalQuoteDto; token?: string | null; onClose: () => void }) {
  const decline = useDeclineQuote(quote.id, token);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<DeclineIn, unknown, DeclineOut>({ resolver: zodResolver(declineQuoteInputSchema), defaultValues: { reason: "" } });
  return (
    <Dialog title="Decline this quote?" description="The shop will see your answer. You can always ask for a new quote later." onClose={onClose}>
      <form
        noValidate
        className="flex flex-col gap-4"
        onSubmit={handleSubmit(async (values) => {
          setProblem(null);
          try {
            await decline.mutateAsync(values);
            onClose();
          } catch (e) {
            setProblem(applyServerErrors(e, setError, ["reason"]));
          }
        })}
      >
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <TextareaField label="Reason (optional)" rows={3} error={errors.reason?.message} {...register("reason")} />
        <FormActions>
          <Button type="submit" variant="danger" size="lg" pending={isSubmitting}>
            Decline quote
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Go back
          </Button>
        </FormActions>
      </form>
    </Dialog>
  );
}

function PayDeposit({ quote, token }: { quote: PortalQuoteDto; token?: string | null }) {
  const checkout = useStartCheckout(token);
  const [problem, setProblem] = useState<string | null>(null);
  const due = quote.depositCents - quote.paidCents;
  return (
    <section aria-labelledby="pay-heading" className="rounded-2xl border-2 border-candy-600 bg-white p-4 shadow-card">
      <h2 id="pay-heading" className="text-lg font-semibold text-ink-950">
        Approved. Book the work with the deposit
      </h2>
      <p className="mt-1 text-sm text-primer-700">
        {formatCents(due)} now by card, on our payment provider's secure page. The balance of {formatCents(quote.balanceCents)} is due when you collect.
      </p>
      {problem ? (
        <Alert tone="error" className="mt-3">
          {problem}
        </Alert>
      ) : null}
      <Button
        className="mt-4"
        size="lg"
        block
        pending={checkout.isPending}
        icon={<CreditCard aria-hidden className="size-5" />}
        onClick={async () => {
          setProblem(null);
          try {
            const { url } = await checkout.mutateAsync(quote.id);
            window.location.assign(url);
          } catch (e) {
            setProblem(isApiError(e) ? e.message : "The payment page could not be opened. Try again in a moment.");
          }
        }}
      >
        Pay deposit {formatCents(due)}
      </Button>
    </section>
  );
}
