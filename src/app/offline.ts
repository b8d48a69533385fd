import type { QueryClient } from "@tanstack/react-query";
import type { SessionUser } from "@shared/schemas/auth.schema";
import { authKeys } from "@/features/auth/api/auth.queries";
import { clearOfflineCache, persistOfflineCache, restoreOfflineCache } from "@/lib/offline/persist";
import { cachedUserId } from "@/lib/offline/owner";
import { flushQueue, offlineQueue } from "@/lib/offline/queue";
import { keepOnTablet } from "./offline-keys";
import { coatIdIn } from "@/features/booth/api/waiting";
import type { BoothDto } from "@shared/schemas/booth.schema";

/** How often waiting entries are tried again while the device says it is online (a booth's Wi-Fi can be up with no route). */
const RETRY_MS = 15_000;

/**
 * The offline booth, started once (see main.tsx). With `restore` (start-up, before the router is made), the cached
 * booth queries are put back first, so a reload with no network still knows who is signed in and shows the cards.
 * Then, while a painter is signed in, the booth queries are kept on the tablet and the queue is sent whenever the
 * connection comes back. For anyone else nothing is kept, and a cache left by another user is wiped.
 */
export async function startOffline(queryClient: QueryClient, restore: boolean) {
  if (restore) await restoreOfflineCache(queryClient);

  let painter: string | null = null;
  let stopKeeping: (() => void) | null = null;
  const follow = (user: SessionUser | null | undefined) => {
    if (user === undefined) return;
    const id = user?.role === "painter" ? user.id : null;
    if (id === painter) return;
    stopKeeping?.();
    stopKeeping = null;
    painter = id;
    const other = cachedUserId();
    if (other && other !== id) void clearOfflineCache();
    if (!id) return;
    stopKeeping = persistOfflineCache(queryClient, id, keepOnTablet);
    void offlineQueue
      .open(id, {
        onSent: (entry, answer) => {
          if (entry.answerKey) queryClient.setQueryData(entry.answerKey, answer);
          for (const key of entry.refresh ?? []) void queryClient.invalidateQueries({ queryKey: key });
        },
        idFrom: (entry, answer) => (entry.kind === "coat" ? coatIdIn(answer as BoothDto, entry.body) : null),
        onRefused: (entry) => {
          for (const key of entry.refresh ?? []) void queryClient.invalidateQueries({ queryKey: key });
        },
      })
      .then(() => (navigator.onLine ? flushQueue() : undefined));
  };
  follow(queryClient.getQueryData<SessionUser | null>(authKeys.me()));
  const meHash = JSON.stringify(authKeys.me());
  queryClient.getQueryCache().subscribe((event) => {
    if (event.type === "updated" && event.query.queryHash === meHash) follow(event.query.state.data as SessionUser | null | undefined);
  });

  window.addEventListener("online", () => {
    if (!painter) return;
    void flushQueue();
  });
  window.setInterval(() => {
    if (painter && navigator.onLine && offlineQueue.snapshot().entries.some((e) => e.state === "waiting")) void flushQueue();
  }, RETRY_MS);
}
