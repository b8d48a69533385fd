import express from "express";
import { randomBytes } from "node:crypto";
import type { Server } from "node:http";
import type { AddressInfo } from "node:net";
import Stripe from "stripe";
import { providerApi } from "./api";
import { checkoutPages } from "./checkout-page";
import { controlApi, createControl } from "./control";
import { createPaymentsState } from "./state";
import { NORMAL_MODE, type DeliveryMode, type PaymentsStandInOptions } from "./types";
import { createWebhookSender } from "./webhooks";

export { TEST_CARDS, type DeliveryMode, type DeliveryRecord, type PaymentsStandInOptions, type StandInEvent } from "./types";

/**
 * A local stand-in for the card-payment provider, for development, the demo and the tests. It speaks the small part
 * of the provider's HTTP API the product uses (api.ts), through the provider's own SDK pointed at it; serves its own
 * checkout page where a test card pays or is declined (checkout-page.ts); and sends signed webhook events
 * (checkout.session.completed, payment_intent.succeeded, checkout.session.expired, charge.refunded, refund.created …)
 * to the product's webhook address, signed with the webhook secret exactly as the provider signs them, retrying
 * deliveries that get no 2xx (webhooks.ts). Tests can make it misbehave through `control` (control.ts).
 */
export async function startPaymentsStandIn(options: PaymentsStandInOptions = {}) {
  const host = options.host ?? "127.0.0.1";
  const apiKey = options.apiKey ?? `sk_test_standin_${randomBytes(12).toString("hex")}`;
  const webhookSecret = options.webhookSecret ?? `whsec_standin_${randomBytes(18).toString("hex")}`;
  let webhookUrl = options.webhookUrl ?? null;
  let baseUrl = "";
  const mode: DeliveryMode = { ...NORMAL_MODE };
  const webhooks = createWebhookSender({ signer: new Stripe(apiKey), secret: webhookSecret, retryDelays: options.retryDelaysMs ?? [300, 1000, 3000, 8000], mode, url: () => webhookUrl });
  const state = createPaymentsState({ mode, webhooks, baseUrl: () => baseUrl });
  const control = createControl(state, webhooks, mode);

  const app = express();
  app.disable("x-powered-by");
  app.use("/v1", providerApi(state, apiKey, mode));
  app.use(checkoutPages(state));
  app.use("/_control", controlApi(control, apiKey));

  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(options.port ?? 0, host, () => resolve(s));
    s.once("error", reject);
  });
  if (options.unref) server.unref();
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://${host === "0.0.0.0" ? "127.0.0.1" : host}:${port}`;

  return {
    port,
    host,
    url: baseUrl,
    apiKey,
    webhookSecret,
    setWebhookUrl(url: string | null) {
      webhookUrl = url;
    },
    control,
    /** SDK settings that point at this stand-in. */
    sdkConfig: { secretKey: apiKey, webhookSecret, host, port, protocol: "http" as const },
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections?.();
        server.close(() => resolve());
      }),
  };
}

export type PaymentsStandIn = Awaited<ReturnType<typeof startPaymentsStandIn>>;
