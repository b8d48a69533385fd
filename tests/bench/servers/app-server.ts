/**
 * Child process: the real app (createApp: every router, guard, middleware and the SPA) on the bench's database and
 * client build. Same wiring as server/index.ts, minus migrate/seed (done by the bench) and the payments stand-in
 * (no measured route uses it). BENCH_SQL_TRACE=<file> logs every SQL statement for the baseline.
 */
import path from "node:path";
import { readEnv } from "../../../server/config";
import { traceSql } from "./sql-trace";

const env = readEnv();
if (process.env.BENCH_SQL_TRACE) traceSql(process.env.BENCH_SQL_TRACE);

const { openDb } = await import("../../../server/db/client");
const { createApp } = await import("../../../server/app");
const { createSmtpMailer } = await import("../../../server/mail/mailer");
const { startSmtpOutbox } = await import("../../../server/stand-ins/smtp-outbox");
const { loadAppSecret } = await import("../../../server/app-secret");
const { createLogger } = await import("../../../server/log/logger");
const { pino } = await import("pino");

const db = openDb(env.dbFile);
const outbox = await startSmtpOutbox(env.outboxDir);
const app = createApp({
  db,
  mailer: createSmtpMailer({ host: "127.0.0.1", port: outbox.port, from: env.MAIL_FROM }),
  appSecret: loadAppSecret(env.APP_SECRET, env.secretFile),
  publicUrl: `http://localhost:${env.PORT}`,
  demoMode: true,
  outboxDir: outbox.dir,
  dataDir: env.dataDir,
  clientDir: path.resolve(process.env.BENCH_CLIENT_DIR ?? "dist"),
  // Request lines are written as in production (a JSON line per request), to /dev/null.
  logger: createLogger({ destination: pino.destination({ dest: "/dev/null", sync: true }) }),
  rateLimits: { signIn: { perAddress: env.SIGNIN_LIMIT_PER_ADDRESS, perAccount: env.SIGNIN_LIMIT_PER_ACCOUNT, windowMs: 15 * 60_000 } },
});
app.listen(env.PORT, "127.0.0.1", () => console.log(`app listening on ${env.PORT}`));
process.once("SIGTERM", () => {
  db.$client.close();
  void outbox.close();
  process.exit(0);
});
