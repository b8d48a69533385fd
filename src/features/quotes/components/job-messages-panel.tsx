import { useQuery } from "@tanstack/react-query";
import { Mail, MailWarning } from "lucide-react";
import { MESSAGE_KIND_LABELS } from "@shared/schemas/message.schema";
import type { Stage } from "@shared/domain/stages";
import { isApiError } from "@/lib/api-client";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { toast } from "@/components/ui/toast/toast-store";
import { formatDateTime } from "@/utils/format-date";
import { quoteQueries, useSendReadyNotice } from "../api/quotes.queries";

/** Every e-mail sent to the customer about this job (and any that failed), newest first. */
export function JobMessagesPanel({ jobId, stage }: { jobId: number; stage: Stage }) {
  const { data, isPending } = useQuery(quoteQueries.messages(jobId));
  const notify = useSendReadyNotice(jobId);
  const items = data?.items ?? [];
  return (
    <Panel
      title="E-mails to the customer"
      titleId="job-messages-heading"
      actions={
        stage === "ready" ? (
          <Button
            variant="secondary"
            size="sm"
            pending={notify.isPending}
            onClick={async () => {
              try {
                const m = await notify.mutateAsync();
                toast.success(`Ready-for-pickup notice sent to ${m.to}`);
              } catch (e) {
                toast.error(isApiError(e) ? e.message : "The notice could not be sent");
              }
            }}
          >
            Notify customer: ready
          </Button>
        ) : null
      }
    >
      {isPending ? (
        <p className="text-sm text-primer-700">Loading…</p>
      ) : items.length === 0 ? (
        <p className="text-sm text-primer-700">Nothing sent yet.</p>
      ) : (
        <ul className="flex flex-col gap-3">
          {items.map((m) => (
            <li key={m.id} className="flex gap-3">
              {m.status === "sent" ? <Mail aria-hidden className="mt-0.5 size-4 shrink-0 text-primer-600" /> : <MailWarning aria-hidden className="mt-0.5 size-4 shrink-0 text-red-700" />}
              <div className="min-w-0 text-sm">
                <p className="font-semibold text-ink-950">
                  {MESSAGE_KIND_LABELS[m.kind]}
                  {m.status === "failed" ? <span className="ml-2 font-semibold text-red-800">Not sent</span> : null}
                </p>
                <p className="truncate text-primer-700" title={m.subject}>
                  {m.subject}
                </p>
                <p className="text-primer-700">
                  To {m.to} · <time dateTime={m.at}>{formatDateTime(m.at)}</time> · {m.byName}
                </p>
                {m.attachments.length ? <p className="text-primer-700">Attached: {m.attachments.join(", ")}</p> : null}
                {m.error ? <p className="text-red-800">{m.error}</p> : null}
              </div>
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}
