import { createStore, get, set, del, type UseStore } from "idb-keyval";
// The API client (and the zod it reads error bodies with) loads with the first send, not with the app's entry.
const client = () => import("@/lib/api-client");
const uploader = () => import("@/lib/upload-with-progress");
import { IDEMPOTENCY_HEADER } from "@shared/api/idempotency";
import { discarded, heldBack, replaced, withOwner, type Replacement } from "./queue-order";

/**
 * The tablet's outbox for booth entries (coats, corrections, prep sign-offs, photos): kept in IndexedDB so a reload, a flat
 * battery or a closed tab loses nothing, and sent in the order they were made when the server can be reached. Each
 * entry has its own random key, sent as the `Idempotency-Key` header, so an entry sent twice (a reply lost on the
 * way back, two tablets, a replay) is stored once by the server.
 */
export type QueuedEntry = {
  /** The entry's Idempotency-Key (a UUID). */
  key: string;
  userId: string;
  kind: "coat" | "correction" | "sign-off" | "photo";
  jobId: number;
  /** API path (under /api) and JSON body, `at` (when it was made) included; for a photo, the form's text fields. */
  path: string;
  body: Record<string, unknown>;
  /** A photo: the picture itself (IndexedDB keeps Blobs), sent as the form's `file` field with `body` beside it. */
  file?: { blob: Blob; name: string };
  /**
   * The key of an earlier entry whose answer gives this one its owner (a photo of a coat still waiting to send): held
   * back until that entry is stored, then its `ownerId` is filled in from the answer.
   */
  waitsFor?: string;
  madeAt: number;
  /** What the painter sees: "Coat 2 of Candy garnet". */
  label: string;
  /** Where the server's answer goes in the query cache, and what to refresh after it. */
  answerKey?: readonly unknown[];
  refresh?: (readonly unknown[])[];
  state: "waiting" | "refused";
  problem?: { status: number; code: string; message: string; fields: Record<string, string> };
};

export type QueueState = {
  entries: QueuedEntry[];
  /** False after a send failed for want of a network, until one gets through. */
  reachable: boolean;
  sending: boolean;
  /** The entry just made, on its first try: the screen waits for the server's answer as for any save. */
  firstTry: string | null;
};

/** A random UUID (v4) for an entry's key; crypto.randomUUID needs https, getRandomValues works on a shop's plain-http LAN too. */
export function newEntryKey(): string {
  const b = crypto.getRandomValues(new Uint8Array(16));
  b[6] = (b[6]! & 0x0f) | 0x40;
  b[8] = (b[8]! & 0x3f) | 0x80;
  const h = [...b].map((x) => x.toString(16).padStart(2, "0")).join("");
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
}

type Handlers = {
  onSent: (entry: QueuedEntry, answer: unknown) => void;
  /** The id of the record an entry stored, read from its answer (for the entries that wait for it), or null. */
  idFrom?: (entry: QueuedEntry, answer: unknown) => number | null;
  /** The server refused the entry: what it shows is out of date. */
  onRefused: (entry: QueuedEntry) => void;
};

let store: UseStore | undefined;
const db = () => (store ??= createStore("coatwright-queue", "entries"));
const storageKey = (userId: string) => `queue:${userId}`;

let state: QueueState = { entries: [], reachable: true, sending: false, firstTry: null };
/** A send that has not answered in this long is taken as no network (a booth's Wi-Fi can be up with no route). */
const SEND_TIMEOUT_MS = 15_000;
/** A photo (up to 15 MB on a weak booth signal) gets longer. */
const PHOTO_TIMEOUT_MS = 120_000;

/** One entry to the server with its key: JSON, or a multipart form through the same upload path as any photo. */
async function post(entry: Pick<QueuedEntry, "key" | "path" | "body" | "file">, timeout: boolean): Promise<unknown> {
  const headers = { [IDEMPOTENCY_HEADER]: entry.key };
  if (!entry.file) {
    const signal = timeout ? AbortSignal.timeout(SEND_TIMEOUT_MS) : undefined;
    return (await client()).api.post<unknown>(entry.path, entry.body, { headers, signal });
  }
  const form = new FormData();
  for (const [name, value] of Object.entries(entry.body)) if (value != null) form.set(name, String(value));
  form.set("file", entry.file.blob, entry.file.name);
  return (await uploader()).uploadWithProgress<unknown>(entry.path, form, undefined, timeout ? AbortSignal.timeout(PHOTO_TIMEOUT_MS) : undefined, headers);
}
let userId: string | null = null;
let handlers: Handlers = { onSent: () => undefined, onRefused: () => undefined };
const listeners = new Set<() => void>();

function setState(patch: Partial<QueueState>) {
  state = { ...state, ...patch };
  listeners.forEach((l) => l());
}

async function save() {
  if (userId) await set(storageKey(userId), state.entries, db());
}

async function change(entries: QueuedEntry[]) {
  setState({ entries });
  await save();
}


let flushing: Promise<void> | null = null;
/** Answers to entries just sent, for the submit that is waiting on them. */
const answers = new Map<string, unknown>();

/** Sends the waiting entries one by one, in the order they were made; stops at the first that cannot get through. */
export function flushQueue(): Promise<void> {
  // Cleared in a later turn (.finally), never before the promise is stored: a send with nothing to do ends at once.
  flushing ??= sendWaiting().finally(() => {
    flushing = null;
  });
  return flushing;
}

async function sendWaiting() {
  try {
    setState({ sending: true });
    for (;;) {
      const entry = state.entries.find((e) => e.state === "waiting" && !heldBack(e, state.entries));
      if (!entry) break;
      const { isApiError } = await client();
      try {
        const answer = await post(entry, true);
        answers.set(entry.key, answer);
        // The answer goes on screen before the entry leaves the queue, so the card never steps back in between.
        handlers.onSent(entry, answer);
        const rest = state.entries.filter((e) => e.key !== entry.key);
        await change(rest.some((e) => e.waitsFor === entry.key) ? withOwner(rest, entry, handlers.idFrom?.(entry, answer) ?? null) : rest);
        setState({ reachable: true });
      } catch (error) {
        const refused = isApiError(error) && error.isClientError && error.status !== 401 && error.status !== 429;
        if (!refused) {
          // No network, a server fault, or the session is over: everything stays, for the next try.
          setState({ reachable: isApiError(error) && error.status !== 0 });
          break;
        }
        const problem = { status: error.status, code: error.code, message: error.message, fields: error.fields };
        await change(state.entries.map((e) => (e.key === entry.key ? { ...e, state: "refused" as const, problem } : e)));
        setState({ reachable: true });
        handlers.onRefused(entry);
      }
    }
  } finally {
    setState({ sending: false });
  }
}

export const offlineQueue = {
  subscribe(listener: () => void) {
    listeners.add(listener);
    return () => listeners.delete(listener);
  },
  snapshot: () => state,

  /** Loads a user's entries from the tablet (at sign-in or start-up) and says what to do with the server's answers. */
  async open(user: string, on: Handlers) {
    handlers = on;
    if (userId === user) return;
    userId = user;
    setState({ entries: ((await get<QueuedEntry[]>(storageKey(user), db())) ?? []).filter((e) => e.userId === user) });
  },

  /**
   * Keeps an entry, then tries to send the queue. Resolves with the server's answer once it is stored, or with
   * `queued` when the server cannot be reached (the entry waits). A refusal while the painter is right there is
   * thrown, like any failed save, and the entry is dropped (nothing was stored). The queue is a painter's: for
   * anyone else (the owner at the booth) the entry is sent straight away, with its key, and not kept.
   */
  async submit(entry: Omit<QueuedEntry, "userId" | "state">): Promise<{ queued: true } | { queued: false; answer: unknown }> {
    if (!userId) return { queued: false, answer: await post(entry, false) };
    setState({ firstTry: entry.key });
    const mine = () => state.entries.find((e) => e.key === entry.key);
    try {
      await change([...state.entries, { ...entry, userId, state: "waiting" }]);
      // A send already under way may have looked for work just before this entry arrived: then one more round.
      for (let round = 0; round < 2 && navigator.onLine && mine()?.state === "waiting" && state.reachable; round++) await flushQueue();
    } finally {
      if (state.firstTry === entry.key) setState({ firstTry: null });
    }
    const now = mine();
    if (!now) {
      const answer = answers.get(entry.key);
      answers.delete(entry.key);
      return { queued: false, answer };
    }
    if (now.state === "refused") {
      await change(state.entries.filter((e) => e.key !== entry.key));
      throw new (await client()).ApiError(now.problem!.status, now.problem!.code, now.problem!.message, now.problem!.fields);
    }
    return { queued: true };
  },

  /** Sends a refused entry again as it is (the office fixed what was in the way). */
  retry: (key: string) => change(state.entries.map((e) => (e.key === key ? { ...e, state: "waiting" as const, problem: undefined } : e))).then(flushQueue),

  /** Replaces a refused entry by a changed one (a new key: it is a different request); entries waiting for it follow. */
  replace: (key: string, changed: Replacement) => change(replaced(state.entries, key, changed)).then(flushQueue),

  /** Drops an entry; any waiting for it (a photo of that coat) is shown as refused, to go on the job or be discarded. */
  discard: (key: string) => change(discarded(state.entries, key)),

  /** Forgets every entry on this tablet (sign-out). */
  async clear() {
    if (userId) await del(storageKey(userId), db());
    userId = null;
    setState({ entries: [] });
  },
};
