import { clearOfflineCache } from "./persist";
import { offlineQueue } from "./queue";

/** Entries on this tablet that have not reached the server (waiting, or refused and not yet fixed). */
export const waitingCount = () => offlineQueue.snapshot().entries.length;

/** Sign-out: the booth cache and the queue leave the tablet. */
export const forgetTablet = () => Promise.all([offlineQueue.clear(), clearOfflineCache()]);
