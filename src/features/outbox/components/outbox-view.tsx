import { Link, useSearchParams } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { Inbox, Paperclip } from "lucide-react";
import { isApiError } from "@/lib/api-client";
import { EmptyState } from "@/components/ui/empty-state";
import { Spinner } from "@/components/ui/spinner";
import { cn } from "@/utils/cn";
import { formatDateTime } from "@/utils/format-date";
import { outboxAttachmentUrl, outboxQueries, type OutboxMessage } from "../api/outbox.queries";

const sizeFormat = new Intl.NumberFormat(undefined, { maximumFractionDigits: 1 });
const formatSize = (bytes: number) => (bytes < 1024 ? `${bytes} B` : bytes < 1024 ** 2 ? `${sizeFormat.format(bytes / 1024)} KB` : `${sizeFormat.format(bytes / 1024 ** 2)} MB`);

/** The demo mail stand-in's messages: a list, and the one chosen (?message=id) opened beside it. */
export function OutboxView() {
  const [searchParams] = useSearchParams();
  const { data, isPending, error } = useQuery(outboxQueries.list());
  if (isPending) return <Spinner label="Loading the outbox…" />;
  if (isApiError(error) && error.status === 404)
    return (
      <EmptyState icon={<Inbox aria-hidden />} title="The outbox is only kept in demo mode">
        This server sends mail through a real mail relay, so there is nothing to read here.
      </EmptyState>
    );
  const messages = data?.items ?? [];
  if (messages.length === 0)
    return (
      <EmptyState icon={<Inbox aria-hidden />} title="No messages yet">
        Mail the product sends (password resets, and later quotes and receipts) lands here in demo mode.
      </EmptyState>
    );

  const openId = searchParams.get("message");
  const open = messages.find((m) => m.id === openId) ?? null;

  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(18rem,24rem)_1fr]">
      <section aria-labelledby="outbox-list-heading" className={cn("self-start overflow-hidden rounded-xl border border-primer-200 bg-white shadow-card", open && "hidden lg:block")}>
        <h2 id="outbox-list-heading" className="border-b border-primer-200 px-4 py-3 text-lg font-semibold">
          Messages <span className="text-sm font-medium text-primer-700">({messages.length})</span>
        </h2>
        <ul className="divide-y divide-primer-100">
          {messages.map((m) => (
            <li key={m.id}>
              <Link
                to={`?message=${encodeURIComponent(m.id)}`}
                aria-current={m.id === openId ? "true" : undefined}
                className={cn("block min-h-11 px-4 py-3 hover:bg-primer-50", m.id === openId && "bg-candy-50 hover:bg-candy-50")}
              >
                <span className="block truncate font-semibold text-ink-950">{m.subject || "(no subject)"}</span>
                <span className="block truncate text-sm text-primer-700">To {m.to.join(", ")}</span>
                <span className="mt-0.5 flex items-center gap-2 text-xs text-primer-700">
                  {formatDateTime(m.receivedAt)}
                  {m.attachments.length ? (
                    <span className="inline-flex items-center gap-0.5">
                      <Paperclip aria-hidden className="size-3" />
                      {m.attachments.length}
                      <span className="sr-only"> attachments</span>
                    </span>
                  ) : null}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      </section>
      {open ? (
        <OutboxMessageView message={open} />
      ) : (
        <div className="hidden rounded-xl border border-dashed border-primer-300 p-10 text-center text-primer-700 lg:block">Choose a message to read it.</div>
      )}
    </div>
  );
}

/** Plain text with its web addresses made into links (so a demo reset link can be followed). */
function LinkedText({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s<>"]+)/g);
  return parts.map((part, i) =>
    i % 2 === 1 ? (
      <a key={i} href={part} className="font-medium break-all text-candy-700 underline underline-offset-2">
        {part}
      </a>
    ) : (
      part
    ),
  );
}

function OutboxMessageView({ message }: { message: OutboxMessage }) {
  return (
    <article aria-labelledby="outbox-message-heading" className="self-start rounded-xl border border-primer-200 bg-white shadow-card">
      <header className="border-b border-primer-200 px-5 py-4">
        <Link to="?" className="mb-2 inline-flex min-h-11 items-center text-sm font-semibold text-candy-700 hover:underline lg:hidden">
          ← All messages
        </Link>
        <h2 id="outbox-message-heading" className="text-xl font-semibold text-ink-950">
          {message.subject || "(no subject)"}
        </h2>
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
          <dt className="text-primer-700">From</dt>
          <dd className="break-all">{message.from}</dd>
          <dt className="text-primer-700">To</dt>
          <dd className="break-all">{message.to.join(", ")}</dd>
          <dt className="text-primer-700">Received</dt>
          <dd>{formatDateTime(message.receivedAt)}</dd>
        </dl>
      </header>
      <div className="px-5 py-4">
        <pre className="font-sans text-sm leading-relaxed break-words whitespace-pre-wrap text-ink-950">{message.text ? <LinkedText text={message.text} /> : "(no text part)"}</pre>
      </div>
      {message.attachments.length ? (
        <footer className="border-t border-primer-200 px-5 py-4">
          <h3 className="mb-2 text-sm font-semibold">Attachments</h3>
          <ul className="flex flex-col gap-2">
            {message.attachments.map((a, i) => (
              <li key={`${a.filename}-${i}`}>
                <a
                  href={outboxAttachmentUrl(message.id, i)}
                  download={a.filename}
                  className="inline-flex min-h-11 items-center gap-2 rounded-lg border border-primer-300 px-3 text-sm font-medium hover:bg-primer-50"
                >
                  <Paperclip aria-hidden className="size-4" />
                  {a.filename}
                  <span className="text-primer-700">
                    ({a.contentType}, {formatSize(a.size)})
                  </span>
                </a>
              </li>
            ))}
          </ul>
        </footer>
      ) : null}
    </article>
  );
}
