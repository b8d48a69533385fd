import type Stripe from "stripe";
import { nowSec, rid, type DeliveryMode, type DeliveryRecord, type StandInEvent } from "./types";

/**
 * The stand-in's webhook sender: makes events, signs them with the webhook secret exactly as the provider does, and
 * posts them to the product. A delivery that gets no 2xx is retried on `retryDelays`. In `mode.hold` events wait for
 * `flush()`; `mode.copies` sends each one several times (same id, same body, as a provider's redelivery is).
 */
export function createWebhookSender(opts: { signer: Stripe; secret: string; retryDelays: number[]; mode: DeliveryMode; url: () => string | null }) {
  const deliveries: DeliveryRecord[] = [];
  const held: StandInEvent[] = [];
  const pending = new Set<Promise<void>>();
  /** Every event made, by id, so it can be replayed. */
  const made = new Map<string, StandInEvent>();

  const sign = (payload: string) => opts.signer.webhooks.generateTestHeaderString({ payload, secret: opts.secret });

  function makeEvent(type: string, object: unknown): StandInEvent {
    const event: StandInEvent = {
      id: rid("evt"),
      object: "event",
      type,
      created: nowSec(),
      api_version: "2026-10-28.endive",
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      data: { object: JSON.parse(JSON.stringify(object)) },
    };
    made.set(event.id, event);
    return event;
  }

  async function deliverOnce(event: StandInEvent, attempt: number): Promise<boolean> {
    const url = opts.url();
    if (!url) return true;
    const payload = JSON.stringify(event);
    let status: number | "error";
    try {
      const res = await fetch(url, { method: "POST", headers: { "content-type": "application/json", "stripe-signature": sign(payload) }, body: payload });
      status = res.status;
      await res.arrayBuffer().catch(() => undefined);
    } catch {
      status = "error";
    }
    deliveries.push({ eventId: event.id, type: event.type, attempt, status, at: new Date().toISOString() });
    return typeof status === "number" && status >= 200 && status < 300;
  }

  /** Sends one event, retrying in the background; resolves when the first attempt of each copy is done. */
  function deliver(event: StandInEvent): Promise<void> {
    let firstDone!: () => void;
    const first = new Promise<void>((r) => (firstDone = r));
    const copies = Math.max(1, opts.mode.copies);
    const job = (async () => {
      for (let copy = 0; copy < copies; copy++) {
        let ok = await deliverOnce(event, 1);
        if (copy === copies - 1) firstDone();
        for (let attempt = 2; !ok; attempt++) {
          const wait = opts.retryDelays[attempt - 2];
          if (wait === undefined) break;
          await new Promise((r) => setTimeout(r, wait).unref?.());
          ok = await deliverOnce(event, attempt);
        }
      }
    })();
    pending.add(job);
    void job.finally(() => {
      pending.delete(job);
      firstDone();
    });
    return first;
  }

  /** Waits until every delivery in flight (with its retries) is done. */
  async function settle() {
    while (pending.size) await Promise.allSettled([...pending]);
  }

  return {
    sign,
    deliveries: () => [...deliveries],
    deliveryCount: () => deliveries.length,
    held: () => [...held],
    /** Every event made so far (delivered or not), oldest first. */
    events: () => [...made.values()],
    emit(type: string, object: unknown) {
      const event = makeEvent(type, object);
      if (opts.mode.hold) held.push(event);
      else void deliver(event);
      return event;
    },
    /** Sends held events (newest first when `reverse`), one after the other; failed ones are retried in the background. */
    async flush() {
      const events = held.splice(0, held.length);
      if (opts.mode.reverse) events.reverse();
      for (const e of events) await deliver(e);
    },
    settle,
    /** Re-sends an event already made (same id, same body), as a provider does when it retries. */
    async replay(eventId: string) {
      const original = made.get(eventId);
      if (!original) return false;
      await deliver(original);
      await settle();
      return true;
    },
    clear() {
      held.length = 0;
      deliveries.length = 0;
    },
  };
}

export type WebhookSender = ReturnType<typeof createWebhookSender>;
