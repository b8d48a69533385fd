import { mkdirSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { readEnv, type AppEnv } from "./config";
import { openDb } from "./db/client";
import { isEmpty, seedDemo } from "./db/seed/index";
import { createApp } from "./app";
import { createSmtpMailer } from "./mail/mailer";
import { startSmtpOutbox } from "./stand-ins/smtp-outbox";
import { startPaymentsStandIn } from "./stand-ins/payments";
import { loadAppSecret } from "./app-secret";
import type { PaymentsConfig } from "./payments/provider";
import { createLogger, type Logger } from "./log/logger";
import { bindPort, type BoundServer } from "./lifecycle/http-server";
import { migrateWithBackup } from "./backups/migrate-with-backup";
import { APP_VERSION } from "./version";

/** Says why the server cannot start, in the log and plainly on stderr, and exits non-zero. */
function refuseToStart(log: Logger | null, message: string): never {
  log?.fatal(message);
  process.stderr.write(`Coatwright cannot start: ${message}\n`);
  process.exit(1);
}

/** Waits at most `ms` for a clean-up step, so one stuck stand-in cannot hold the stop up. */
const atMost = (ms: number, p: Promise<unknown> | undefined) => Promise.race([p, new Promise((r) => setTimeout(r, ms).unref())]);

/**
 * Starts the whole product on one port: take the port (before touching any data), back up and migrate the
 * database, seed the demo shop into an empty one, start the stand-ins (unless real services are configured), then
 * serve the API and the built SPA and start the backup schedule. SIGTERM/SIGINT stop it gracefully.
 */
export async function main() {
  let env: AppEnv;
  try {
    env = readEnv();
  } catch (err) {
    refuseToStart(null, (err as Error).message);
  }
  const log = createLogger({ level: env.LOG_LEVEL });

  let http: BoundServer;
  try {
    http = await bindPort(env.PORT);
  } catch (err) {
    refuseToStart(log, (err as Error).message);
  }

  mkdirSync(env.dataDir, { recursive: true });
  const db = openDb(env.dbFile);
  try {
    await migrateWithBackup(db, { uploadsDir: env.uploadsDir, backupDir: env.backupDir, keep: env.BACKUP_KEEP, log });
  } catch (err) {
    db.$client.close();
    refuseToStart(log, (err as Error).message);
  }
  if (isEmpty(db)) {
    await seedDemo(db, Date.now(), { uploadsDir: env.uploadsDir });
    log.info("Seeded the demo shop (sign in with the demo accounts in the README).");
  }

  const outbox = env.SMTP_HOST ? null : await startSmtpOutbox(env.outboxDir);
  const mailer = createSmtpMailer(
    env.SMTP_HOST
      ? { host: env.SMTP_HOST, port: env.SMTP_PORT ?? 587, secure: env.SMTP_SECURE === "1", user: env.SMTP_USER, pass: env.SMTP_PASS, from: env.MAIL_FROM }
      : { host: "127.0.0.1", port: outbox!.port, from: env.MAIL_FROM },
    log,
  );

  // Card payments: the real provider when STRIPE_SECRET_KEY is set, otherwise the local stand-in.
  if (env.STRIPE_SECRET_KEY && !env.STRIPE_WEBHOOK_SECRET) refuseToStart(log, "Set STRIPE_WEBHOOK_SECRET (the webhook signing secret) along with STRIPE_SECRET_KEY");
  const paymentsStandIn = env.STRIPE_SECRET_KEY ? null : await startPaymentsStandIn({ webhookSecret: env.STRIPE_WEBHOOK_SECRET });
  const payments: PaymentsConfig = paymentsStandIn
    ? paymentsStandIn.sdkConfig
    : { secretKey: env.STRIPE_SECRET_KEY!, webhookSecret: env.STRIPE_WEBHOOK_SECRET!, host: env.STRIPE_API_HOST, port: env.STRIPE_API_PORT, protocol: env.STRIPE_API_PROTOCOL };

  const app = createApp({
    db,
    mailer,
    appSecret: loadAppSecret(env.APP_SECRET, env.secretFile),
    payments,
    publicUrl: env.PUBLIC_URL ?? `http://localhost:${http.port}`,
    demoMode: env.demoMode,
    outboxDir: outbox ? outbox.dir : null,
    dataDir: env.dataDir,
    clientDir: fileURLToPath(new URL("../dist", import.meta.url)),
    trustProxy: env.TRUST_PROXY === "1",
    rateLimits: { signIn: { perAddress: env.SIGNIN_LIMIT_PER_ADDRESS, perAccount: env.SIGNIN_LIMIT_PER_ACCOUNT, windowMs: 15 * 60_000 } },
    logger: log,
    backups: { dir: env.backupDir, everyHours: env.BACKUP_EVERY_HOURS, keep: env.BACKUP_KEEP },
  });
  http.serve(app);
  paymentsStandIn?.setWebhookUrl(`http://127.0.0.1:${http.port}/api/payments/webhook`);
  log.info({ version: APP_VERSION, port: http.port, dataDir: env.dataDir }, `Coatwright is running on http://localhost:${http.port}`);
  if (outbox) log.info(`Local SMTP stand-in on 127.0.0.1:${outbox.port}; messages kept in ${outbox.dir}`);
  if (paymentsStandIn) log.info(`Local payments stand-in on ${paymentsStandIn.url} (test card 4242 4242 4242 4242 pays)`);
  app.deps.backups.start();

  let stopping = false;
  const shutdown = async (signal: NodeJS.Signals) => {
    if (stopping) return;
    stopping = true;
    log.info({ signal, inFlight: http.inFlight() }, "Stopping: finishing the requests in flight");
    const { cut } = await http.close(env.SHUTDOWN_GRACE_SECONDS * 1000, () => log.info({ inFlight: http.inFlight() }, "No longer accepting connections"));
    if (cut) log.warn({ cut }, `Cut ${cut} request(s) still running after ${env.SHUTDOWN_GRACE_SECONDS} s`);
    await app.deps.backups.stop();
    await atMost(2000, outbox?.close());
    await atMost(2000, paymentsStandIn?.close());
    db.$client.close();
    log.info("Stopped");
    process.exit(0);
  };
  // A second signal while stopping is ignored (not the default kill), so a supervisor that repeats itself waits too.
  process.on("SIGINT", shutdown);
  process.on("SIGTERM", shutdown);
  return http.server;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await main();
}
