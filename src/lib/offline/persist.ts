import { persistQueryClientRestore, persistQueryClientSubscribe, type PersistedClient, type Persister } from "@tanstack/query-persist-client-core";
import type { Query, QueryClient, QueryKey } from "@tanstack/react-query";
import { clear, createStore, del, get, set, type UseStore } from "idb-keyval";
import { cachedUserId, OWNER_KEY } from "./owner";

/**
 * The painter's booth cards kept on the tablet (IndexedDB), so they open after a reload with no network. Only the
 * queries `keep` allows are written (the app passes the painter's booth queries: see src/app/offline-keys.ts), and
 * only for a painter; sign-out wipes it. `localStorage` remembers whose cache is on the tablet, so start-up knows
 * whether to wait for a restore before the first screen.
 */
/** Bumped when a cached answer's shape changes: an older cache is then dropped, not shown. */
const BUSTER = "booth-cache-1";
const MAX_AGE_MS = 14 * 24 * 60 * 60 * 1000;

let store: UseStore | undefined;
const db = () => (store ??= createStore("coatwright-cache", "queries"));
/** Which user's cache is being written now; a save planned for anyone else (or after sign-out) is dropped. */
let writing: string | null = null;

function idbPersister(userId: string): Persister {
  const key = `cache:${userId}`;
  let pending: PersistedClient | null = null;
  let timer: number | undefined;
  return {
    // Every cache change asks for a save: write at most twice a second, the latest state.
    persistClient(client) {
      pending = client;
      timer ??= window.setTimeout(() => {
        timer = undefined;
        if (pending && writing === userId) void set(key, pending, db());
      }, 500);
    },
    restoreClient: () => get<PersistedClient>(key, db()),
    removeClient: () => del(key, db()),
  };
}


/** Puts the cached queries of the user whose cache is on this tablet back into the client (resolves either way). */
export async function restoreOfflineCache(queryClient: QueryClient) {
  const userId = cachedUserId();
  if (!userId) return;
  // A broken IndexedDB must not keep the app from starting.
  const gaveUp = new Promise<void>((resolve) => window.setTimeout(resolve, 2000));
  await Promise.race([persistQueryClientRestore({ queryClient, persister: idbPersister(userId), buster: BUSTER, maxAge: MAX_AGE_MS }).catch(() => undefined), gaveUp]);
}

/** Keeps the allowed queries of this user on the tablet as they change; returns the function that stops it. */
export function persistOfflineCache(queryClient: QueryClient, userId: string, keep: (key: QueryKey) => boolean) {
  localStorage.setItem(OWNER_KEY, userId);
  writing = userId;
  const stop = persistQueryClientSubscribe({
    queryClient,
    persister: idbPersister(userId),
    buster: BUSTER,
    dehydrateOptions: {
      shouldDehydrateQuery: (q: Query) => q.state.status === "success" && keep(q.queryKey),
      shouldDehydrateMutation: () => false,
    },
  });
  return () => {
    if (writing === userId) writing = null;
    stop();
  };
}

/** Wipes every cached answer from the tablet. */
export async function clearOfflineCache() {
  writing = null;
  localStorage.removeItem(OWNER_KEY);
  await clear(db());
}
