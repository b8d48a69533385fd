import express from "express";
import { requireKey } from "./api";
import type { PaymentsState } from "./state";
import { NORMAL_MODE, type DeliveryMode } from "./types";
import type { WebhookSender } from "./webhooks";

/**
 * Ways to make the stand-in misbehave on purpose, for tests (and a curious developer): deliver every event twice,
 * hold events and deliver them in reverse order, or report a paid amount different from the session's.
 */
export function createControl(state: PaymentsState, webhooks: WebhookSender, mode: DeliveryMode) {
  return {
    setMode(patch: Partial<DeliveryMode>) {
      Object.assign(mode, patch);
      return { ...mode };
    },
    reset() {
      Object.assign(mode, NORMAL_MODE);
      webhooks.clear();
    },
    pay: state.pay,
    expire: state.expire,
    flush: webhooks.flush,
    settle: webhooks.settle,
    deliveries: webhooks.deliveries,
    /** Every event made so far (delivered or not), oldest first. */
    events: webhooks.events,
    /** Signs a payload as a delivery would be signed (for tests that post events themselves). */
    sign: webhooks.sign,
    held: webhooks.held,
    session: state.session,
    /** Re-sends an event already sent (same id, same body), as a provider does when it retries. */
    replay: webhooks.replay,
  };
}

export type StandInControl = ReturnType<typeof createControl>;

/**
 * The controls over HTTP (/_control). They change what the stand-in reports as paid and re-send events, so they need
 * the stand-in's own secret key (as its API does), like any other caller of a payment provider.
 */
export function controlApi(control: StandInControl, apiKey: string) {
  const ctl = express.Router();
  ctl.use(requireKey(apiKey, "The stand-in's controls need its secret key: Authorization: Bearer <secret key>."));
  ctl.use(express.json());
  ctl.post("/mode", (req, res) => {
    const b = req.body ?? {};
    res.json(
      control.setMode({
        ...(Number.isInteger(b.copies) && b.copies >= 1 && b.copies <= 5 ? { copies: b.copies } : {}),
        ...(typeof b.hold === "boolean" ? { hold: b.hold } : {}),
        ...(typeof b.reverse === "boolean" ? { reverse: b.reverse } : {}),
        ...(b.paidAmountOverride === null || Number.isInteger(b.paidAmountOverride) ? { paidAmountOverride: b.paidAmountOverride ?? null } : {}),
      }),
    );
  });
  ctl.post("/reset", (_req, res) => {
    control.reset();
    res.json({ ok: true });
  });
  ctl.post("/flush", async (_req, res) => {
    await control.flush();
    res.json({ delivered: control.deliveries().length });
  });
  ctl.post("/replay/:eventId", async (req, res) => {
    res.status((await control.replay(req.params.eventId)) ? 200 : 404).json({ ok: true });
  });
  ctl.get("/deliveries", (_req, res) => {
    res.json({ items: control.deliveries() });
  });
  return ctl;
}
