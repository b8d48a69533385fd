import { useEffect, useMemo, useState } from "react";
import type { BoothDto } from "@shared/schemas/booth.schema";
import { useOfflineQueue } from "@/lib/offline/use-offline";

type Parts = typeof import("../components/offline-parts");

/**
 * The card to show and the panel of entries on this tablet: while the tablet holds entries for this job, the card
 * moves on over the coats still waiting to send (the server's card itself stays as the server sent it).
 */
export function useCardWithQueue(card: BoothDto | undefined, receivedAt: number) {
  const queue = useOfflineQueue();
  const jobId = card?.job.id;
  // An entry on its first try is not shown as waiting: the log button shows it is being saved, as online.
  const entries = useMemo(() => queue.entries.filter((e) => e.key !== queue.firstTry), [queue.entries, queue.firstTry]);
  const holds = entries.some((e) => e.jobId === jobId);
  const [parts, setParts] = useState<Parts | null>(null);
  useEffect(() => {
    if (holds && !parts) void import("../components/offline-parts").then((m) => setParts(m));
  }, [holds, parts]);
  const shown = useMemo(
    () => (card && parts && holds ? parts.withWaitingCoats(card, entries, Date.parse(card.serverNow) - receivedAt + Date.now()) : card),
    [card, parts, holds, entries, receivedAt],
  );
  return { shown, queued: card && parts && holds ? <parts.QueuedEntries card={card} /> : null };
}
