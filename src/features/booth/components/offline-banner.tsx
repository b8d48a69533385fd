import { useEffect, useRef, useState } from "react";
import { Link } from "react-router";
import { CheckCircle2, CloudOff, RefreshCw, TriangleAlert } from "lucide-react";
import { useOfflineQueue, useOnline } from "@/lib/offline/use-offline";
import { cn } from "@/utils/cn";

const entries = (n: number) => `${n} ${n === 1 ? "entry" : "entries"}`;

/**
 * The line at the top of the painter's screens that always says where the tablet's entries are: "Offline: 3 entries
 * waiting to send", "Sending…", then "All sent"; and any entry the server refused, with a link to its booth card.
 */
export function OfflineBanner({ boothPath }: { boothPath: (jobId: number) => string }) {
  const online = useOnline();
  const queue = useOfflineQueue();
  const waiting = queue.entries.filter((e) => e.state === "waiting" && e.key !== queue.firstTry).length;
  const refused = queue.entries.filter((e) => e.state === "refused");
  const [allSent, setAllSent] = useState(false);
  const hadWaiting = useRef(0);
  useEffect(() => {
    if (waiting > 0) {
      hadWaiting.current = waiting;
      setAllSent(false);
      return;
    }
    if (hadWaiting.current === 0) return;
    hadWaiting.current = 0;
    setAllSent(true);
    const id = window.setTimeout(() => setAllSent(false), 8000);
    return () => window.clearTimeout(id);
  }, [waiting]);

  let line: { tone: "offline" | "sending" | "done"; text: string } | null = null;
  if (!online) line = { tone: "offline", text: waiting ? `Offline: ${entries(waiting)} waiting to send` : "Offline: the booth card still works, and what you log waits on this tablet" };
  else if (waiting) line = { tone: "sending", text: queue.sending ? `Sending ${entries(waiting)}…` : `${entries(waiting)} waiting to send` };
  else if (allSent && !refused.length) line = { tone: "done", text: "All sent" };

  return (
    <div role="status" aria-live="polite" className="mb-4 flex flex-col gap-2 empty:hidden" data-testid="offline-banner">
      {line ? (
        <p
          className={cn(
            "flex min-h-12 items-center gap-3 rounded-xl border-2 px-4 py-2 text-lg font-semibold",
            line.tone === "offline" ? "border-ink-900 bg-ink-950 text-white" : line.tone === "sending" ? "border-flake-600 bg-flake-50 text-flake-900" : "border-emerald-700 bg-emerald-50 text-emerald-950",
          )}
        >
          {line.tone === "offline" ? <CloudOff aria-hidden className="size-6 shrink-0" /> : line.tone === "sending" ? <RefreshCw aria-hidden className="size-6 shrink-0" /> : <CheckCircle2 aria-hidden className="size-6 shrink-0" />}
          {line.text}
        </p>
      ) : null}
      {refused.length ? (
        <p className="flex min-h-12 flex-wrap items-center gap-x-3 gap-y-1 rounded-xl border-2 border-red-700 bg-red-50 px-4 py-2 text-lg font-semibold text-red-950">
          <TriangleAlert aria-hidden className="size-6 shrink-0" />
          {entries(refused.length)} not accepted by the server: fix or discard on the booth card
          {[...new Set(refused.map((e) => e.jobId))].map((jobId) => (
            <Link key={jobId} to={boothPath(jobId)} className="underline underline-offset-2">
              Job #{jobId}
            </Link>
          ))}
        </p>
      ) : null}
    </div>
  );
}
