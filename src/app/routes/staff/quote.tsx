import { useState } from "react";
import { Link, useNavigate } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { FileText, Layers, PencilLine, Send, Trash2 } from "lucide-react";
import { formatCents } from "@shared/quote/index";
import type { QuoteDetailDto } from "@shared/schemas/quote.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button, buttonClasses } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { FormActions } from "@/components/ui/form/form-actions";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { AccessGate } from "@/features/auth/components/access-gate";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { quotePdfUrl, quoteQueries, useDiscardDraft, useFillMaterials, useReviseQuote, useUpdateQuote } from "@/features/quotes/api/quotes.queries";
import { QuoteEditor } from "@/features/quotes/components/quote-editor";
import { QuoteHistory } from "@/features/quotes/components/quote-history";
import { QuotePaymentsPanel } from "@/features/quotes/components/quote-payments-panel";
import { QuoteStatusBadge } from "@/features/quotes/components/quote-status-badge";
import { QuoteVersionView } from "@/features/quotes/components/quote-view";
import { SendQuoteDialog } from "@/features/quotes/components/send-quote-dialog";
import { formatDate, formatDateTime } from "@/utils/format-date";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

export default function QuoteRoute() {
  return (
    <AccessGate access="office">
      <QuoteLoader />
    </AccessGate>
  );
}

function QuoteLoader() {
  const { id, valid } = useIdParam("quoteId");
  const { data, error, isPending } = useQuery({ ...quoteQueries.detail(id), enabled: valid });
  if (!valid || (isApiError(error) && (error.status === 404 || error.status === 400)))
    return <InPageNotFound what="Quote" backTo={paths.quotes} backLabel="Back to quotes" />;
  if (isPending || !data) return <Spinner label="Loading the quote…" />;
  return <QuotePage quote={data} />;
}

function QuotePage({ quote }: { quote: QuoteDetailDto }) {
  const user = useCurrentUser();
  const navigate = useNavigate();
  const v = quote.current;
  const [dialog, setDialog] = useState<"send" | "discard" | null>(null);
  const update = useUpdateQuote(quote.id);
  const revise = useReviseQuote(quote.id);
  const fill = useFillMaterials(quote.id);
  const draft = v.status === "draft";

  const pdfLink = (
    <a href={quotePdfUrl(quote.id)} target="_blank" rel="noreferrer" className={buttonClasses({ variant: "secondary" })}>
      <FileText aria-hidden className="size-4" />
      {draft ? "Preview PDF" : "PDF"}
    </a>
  );

  return (
    <>
      <PageHeader
        documentTitle={`Quote #${quote.id} · ${quote.jobTitle}`}
        eyebrow={
          <span className="flex flex-wrap items-center gap-2">
            <span className="tabular-nums">
              Quote #{quote.id} · version {quote.version}
            </span>
            <QuoteStatusBadge status={quote.status} />
          </span>
        }
        title={
          <Link to={paths.job(quote.jobId)} className="hover:text-candy-700 hover:underline">
            {quote.jobTitle}
          </Link>
        }
        description={`${quote.customerName}${quote.customerEmail ? ` · ${quote.customerEmail}` : ""}`}
        actions={
          draft ? (
            pdfLink
          ) : (
            <>
              {pdfLink}
              {quote.status === "sent" || quote.status === "viewed" ? (
                <Button variant="secondary" icon={<Send aria-hidden className="size-4" />} onClick={() => setDialog("send")}>
                  Send again
                </Button>
              ) : null}
              {quote.status !== "approved" ? (
                <Button
                  icon={<PencilLine aria-hidden className="size-4" />}
                  pending={revise.isPending}
                  onClick={async () => {
                    try {
                      await revise.mutateAsync();
                      toast.success(`Version ${quote.version + 1} started; version ${quote.version} stays as sent`);
                    } catch (e) {
                      toast.error(isApiError(e) ? e.message : "Could not start a new version");
                    }
                  }}
                >
                  Revise (new version)
                </Button>
              ) : null}
            </>
          )
        }
      />

      <StatusNote quote={quote} />

      {draft ? (
        <>
          {quote.planProblems.length ? (
            <Alert tone="warning" title="Some plan layers could not be priced" className="mb-6">
              <ul className="list-disc pl-5">
                {quote.planProblems.map((p) => (
                  <li key={p}>{p}</li>
                ))}
              </ul>
            </Alert>
          ) : null}
          <QuoteEditor
            key={`${quote.id}-${quote.version}-${v.updatedAt}`}
            quote={quote}
            busy={fill.isPending}
            onSave={async (values) => {
              const saved = await update.mutateAsync(values);
              toast.success("Draft saved");
              return saved;
            }}
            actions={(save, dirty) => (
              <>
                <Button
                  variant="dark"
                  size="lg"
                  icon={<Send aria-hidden className="size-4" />}
                  onClick={async () => {
                    if (dirty && !(await save())) return;
                    setDialog("send");
                  }}
                >
                  Send to customer…
                </Button>
                {quote.planAvailable ? (
                  <Button
                    variant="secondary"
                    size="lg"
                    icon={<Layers aria-hidden className="size-4" />}
                    pending={fill.isPending}
                    onClick={async () => {
                      if (dirty && !(await save())) return;
                      try {
                        await fill.mutateAsync();
                        toast.success("Materials lines filled from the finish plan's estimate");
                      } catch (e) {
                        toast.error(isApiError(e) ? e.message : "Could not fill the materials");
                      }
                    }}
                  >
                    Fill materials from plan
                  </Button>
                ) : null}
                <Button variant="ghost" size="lg" icon={<Trash2 aria-hidden className="size-4" />} onClick={() => setDialog("discard")}>
                  {quote.version > 1 ? "Discard this version" : "Discard draft"}
                </Button>
              </>
            )}
          />
        </>
      ) : (
        <QuoteVersionView version={v} paidCents={quote.paidCents} />
      )}

      <div className="mt-6 grid gap-6 lg:grid-cols-2">
        <QuoteHistory quote={quote} />
        <QuotePaymentsPanel quoteId={quote.id} isOwner={user.role === "owner"} />
      </div>

      {dialog === "send" ? <SendQuoteDialog quote={quote} onClose={() => setDialog(null)} /> : null}
      {dialog === "discard" ? (
        <DiscardDialog
          quote={quote}
          onClose={() => setDialog(null)}
          onGone={() => navigate(paths.job(quote.jobId), { replace: true })}
        />
      ) : null}
    </>
  );
}

/** One sentence on where the quote stands and what changing it does. */
function StatusNote({ quote }: { quote: QuoteDetailDto }) {
  const v = quote.current;
  switch (quote.status) {
    case "draft":
      return quote.offeredVersion ? (
        <Alert tone="info" className="mb-6">
          The customer still sees version {quote.offeredVersion} until you send this one.
        </Alert>
      ) : null;
    case "sent":
    case "viewed":
      return (
        <Alert tone="info" className="mb-6">
          {quote.status === "viewed" ? `The customer opened it ${formatDateTime(v.viewedAt)}.` : `Sent ${formatDateTime(v.sentAt)} to ${v.sentTo}.`} Waiting for an answer until {formatDate(v.validUntil)}. A
          change makes version {quote.version + 1}; this one stays as sent.
        </Alert>
      );
    case "approved":
      return (
        <Alert tone="success" className="mb-6" title={`Approved by ${v.decisionName ?? "the customer"} ${formatDateTime(v.decidedAt)}`}>
          {quote.paidCents >= v.totals.depositCents
            ? `Deposit of ${formatCents(quote.paidCents)} received.`
            : `Deposit of ${formatCents(v.totals.depositCents)} not received yet.`}{" "}
          An approved quote no longer changes; extra work is a new quote.
        </Alert>
      );
    case "declined":
      return (
        <Alert tone="warning" className="mb-6" title={`Declined ${formatDateTime(v.decidedAt)}`}>
          {v.decisionNote ? `“${v.decisionNote}”. ` : ""}Revise it to offer a new version.
        </Alert>
      );
    case "expired":
      return (
        <Alert tone="warning" className="mb-6" title={`Expired on ${formatDate(v.validUntil)}`}>
          The customer can no longer approve it. Revise it to send a new version with a fresh date.
        </Alert>
      );
  }
}

function DiscardDialog({ quote, onClose, onGone }: { quote: QuoteDetailDto; onClose: () => void; onGone: () => void }) {
  const discard = useDiscardDraft(quote.id);
  const [problem, setProblem] = useState<string | null>(null);
  const whole = quote.version === 1;
  return (
    <Dialog title={whole ? "Discard this draft quote?" : `Discard version ${quote.version}?`} onClose={onClose}>
      <p className="text-sm text-ink-900">
        {whole ? "The quote was never sent; it is deleted." : `The draft is deleted; version ${quote.version - 1} stays as the customer has it.`}
      </p>
      {problem ? (
        <Alert tone="error" className="mt-4">
          {problem}
        </Alert>
      ) : null}
      <FormActions className="mt-4">
        <Button
          variant="danger"
          pending={discard.isPending}
          onClick={async () => {
            try {
              const r = await discard.mutateAsync();
              toast.success(r.deleted === "quote" ? "Draft quote deleted" : "Draft version discarded");
              if (r.deleted === "quote") onGone();
              else onClose();
            } catch (e) {
              setProblem(isApiError(e) ? e.message : "Could not discard the draft");
            }
          }}
        >
          Discard
        </Button>
        <Button variant="ghost" onClick={onClose}>
          Keep it
        </Button>
      </FormActions>
    </Dialog>
  );
}
