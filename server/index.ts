import { mkdirSync } from "node:fs";
import type { AddressInfo } from "node:net";
import { fileURLToPath } from "node:url";
import { readEnv } from "./config";
import { migrateDb, openDb } from "./db/client";
import { isEmpty, seedDemo } from "./db/seed/index";
import { createApp } from "./app";
import { createSmtpMailer } from "./mail/mailer";
import { startSmtpOutbox } from "./stand-ins/smtp-outbox";
import { startPaymentsStandIn } from "./stand-ins/payments";
import { loadAppSecret } from "./app-secret";
import type { PaymentsConfig } from "./payments/provider";

/**
 * Starts the whole product on one port: migrations, demo seed on an empty database,
 * the local SMTP stand-in (unless a real SMTP_HOST is set), the API and the built SPA.
 */
export async function main() {
  const env = readEnv();
  mkdirSync(env.dataDir, { recursive: true });
  const db = openDb(env.dbFile);
  migrateDb(db);
  if (isEmpty(db)) {
    await seedDemo(db, Date.now(), { uploadsDir: env.uploadsDir });
    console.log("Seeded the demo shop (sign in with the demo accounts in the README).");
  }

  const outbox = env.SMTP_HOST ? null : await startSmtpOutbox(env.outboxDir);
  const mailer = createSmtpMailer(
    env.SMTP_HOST
      ? { host: env.SMTP_HOST, port: env.SMTP_PORT ?? 587, secure: env.SMTP_SECURE === "1", user: env.SMTP_USER, pass: env.SMTP_PASS, from: env.MAIL_FROM }
      : { host: "127.0.0.1", port: outbox!.port, from: env.MAIL_FROM },
  );

  // Card payments: the real provider when STRIPE_SECRET_KEY is set, otherwise the local stand-in.
  if (env.STRIPE_SECRET_KEY && !env.STRIPE_WEBHOOK_SECRET) throw new Error("Set STRIPE_WEBHOOK_SECRET (the webhook signing secret) along with STRIPE_SECRET_KEY");
  const paymentsStandIn = env.STRIPE_SECRET_KEY ? null : await startPaymentsStandIn({ webhookSecret: env.STRIPE_WEBHOOK_SECRET });
  const payments: PaymentsConfig = paymentsStandIn
    ? paymentsStandIn.sdkConfig
    : { secretKey: env.STRIPE_SECRET_KEY!, webhookSecret: env.STRIPE_WEBHOOK_SECRET!, host: env.STRIPE_API_HOST, port: env.STRIPE_API_PORT, protocol: env.STRIPE_API_PROTOCOL };

  const app = createApp({
    db,
    mailer,
    appSecret: loadAppSecret(env.APP_SECRET, env.secretFile),
    payments,
    publicUrl: env.PUBLIC_URL ?? `http://localhost:${env.PORT}`,
    demoMode: env.demoMode,
    outboxDir: outbox ? outbox.dir : null,
    dataDir: env.dataDir,
    clientDir: fileURLToPath(new URL("../dist", import.meta.url)),
    trustProxy: env.TRUST_PROXY === "1",
    rateLimits: { signIn: { perAddress: env.SIGNIN_LIMIT_PER_ADDRESS, perAccount: env.SIGNIN_LIMIT_PER_ACCOUNT, windowMs: 15 * 60_000 } },
  });

  const server = app.listen(env.PORT, () => {
    const port = (server.address() as AddressInfo).port;
    console.log(`Coatwright is running on http://localhost:${port}`);
    if (outbox) console.log(`Local SMTP stand-in on 127.0.0.1:${outbox.port}; messages kept in ${outbox.dir}`);
    if (paymentsStandIn) {
      paymentsStandIn.setWebhookUrl(`http://127.0.0.1:${port}/api/payments/webhook`);
      console.log(`Local payments stand-in on ${paymentsStandIn.url} (test card 4242 4242 4242 4242 pays)`);
    }
  });

  const shutdown = () => {
    server.close();
    void outbox?.close();
    void paymentsStandIn?.close();
    db.$client.close();
    process.exit(0);
  };
  process.once("SIGINT", shutdown);
  process.once("SIGTERM", shutdown);
  return server;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await main();
}
