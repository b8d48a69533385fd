import { useSyncExternalStore } from "react";
import { offlineQueue } from "./queue";

function subscribeOnline(listener: () => void) {
  window.addEventListener("online", listener);
  window.addEventListener("offline", listener);
  return () => {
    window.removeEventListener("online", listener);
    window.removeEventListener("offline", listener);
  };
}

/** Whether the server can be reached: the device says it is online, and the last send did not fail for want of a network. */
export function useOnline(): boolean {
  const deviceOnline = useSyncExternalStore(subscribeOnline, () => navigator.onLine);
  const reachable = useSyncExternalStore(offlineQueue.subscribe, () => offlineQueue.snapshot().reachable);
  return deviceOnline && reachable;
}

/** The tablet's queue of entries waiting to send (and any the server refused). */
export function useOfflineQueue() {
  return useSyncExternalStore(offlineQueue.subscribe, offlineQueue.snapshot);
}
