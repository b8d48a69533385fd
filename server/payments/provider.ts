import Stripe from "stripe";

/** How to reach the card-payment provider: the real service, or the local stand-in (server/stand-ins/payments/). */
export type PaymentsConfig = {
  secretKey: string;
  webhookSecret: string;
  host?: string;
  port?: number;
  protocol?: "http" | "https";
  currency?: string;
};

export type Payments = { stripe: Stripe; webhookSecret: string; currency: string };

/** The provider's SDK, pointed where the config says. No automatic retries: a failure is reported at once. */
export function createPayments(config: PaymentsConfig): Payments {
  const stripe = new Stripe(config.secretKey, {
    maxNetworkRetries: 0,
    timeout: 20_000,
    ...(config.host ? { host: config.host } : {}),
    ...(config.port ? { port: config.port } : {}),
    ...(config.protocol ? { protocol: config.protocol } : {}),
  });
  return { stripe, webhookSecret: config.webhookSecret, currency: (config.currency ?? "usd").toLowerCase() };
}
