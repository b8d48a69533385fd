import path from "node:path";
import { z } from "zod";

const envSchema = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATA_DIR: z.string().default("./data"),
  /** Public base URL used in e-mailed links. Defaults to http://localhost:PORT. */
  PUBLIC_URL: z.url().optional(),
  /** Real SMTP relay; when SMTP_HOST is unset, the local outbox stand-in is started instead. */
  SMTP_HOST: z.string().optional(),
  SMTP_PORT: z.coerce.number().int().positive().optional(),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  SMTP_SECURE: z.enum(["0", "1"]).optional(),
  MAIL_FROM: z.string().default("Coatwright <no-reply@coatwright.test>"),
  /** Demo mode shows the outbox to the owner. On by default with the local stand-ins. */
  DEMO_MODE: z.enum(["0", "1"]).optional(),
  TRUST_PROXY: z.enum(["0", "1"]).default("0"),
  /** Sign-in attempts allowed per address and failed attempts per account in 15 minutes. */
  SIGNIN_LIMIT_PER_ADDRESS: z.coerce.number().int().positive().default(30),
  SIGNIN_LIMIT_PER_ACCOUNT: z.coerce.number().int().positive().default(8),
  /** Secret for signed links (at least 32 characters). When unset, one is generated once and kept in DATA_DIR/secret. */
  APP_SECRET: z.string().min(32, "APP_SECRET must be at least 32 characters").optional(),
  /** Card payments. Without STRIPE_SECRET_KEY the local payments stand-in is started and used instead. */
  STRIPE_SECRET_KEY: z.string().min(1).optional(),
  STRIPE_WEBHOOK_SECRET: z.string().min(1).optional(),
  /** Where the payments SDK sends its requests (defaults to the provider's own API). */
  STRIPE_API_HOST: z.string().min(1).optional(),
  STRIPE_API_PORT: z.coerce.number().int().positive().max(65535).optional(),
  STRIPE_API_PROTOCOL: z.enum(["http", "https"]).optional(),
  /** Scheduled online backups: where they go, how often (hours, fractions allowed; 0 turns the schedule off), how many to keep. */
  BACKUP_DIR: z.string().min(1).optional(),
  BACKUP_EVERY_HOURS: z.coerce.number({ error: "BACKUP_EVERY_HOURS must be a number of hours" }).min(0).max(24 * 366).default(24),
  BACKUP_KEEP: z.coerce.number().int().min(1, "BACKUP_KEEP must keep at least one backup").max(10_000).default(14),
  /** Log level of the JSON log on stdout. */
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  /** How long a stop (SIGTERM, SIGINT) waits for requests in flight before closing their connections. */
  SHUTDOWN_GRACE_SECONDS: z.coerce.number().min(0).max(600).default(10),
});

export type Env = z.infer<typeof envSchema>;

export function readEnv(source: NodeJS.ProcessEnv = process.env) {
  const result = envSchema.safeParse(source);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`).join("\n");
    throw new Error(`Invalid environment:\n${lines}`);
  }
  const env = result.data;
  const dataDir = path.resolve(env.DATA_DIR);
  return {
    ...env,
    dataDir,
    dbFile: path.join(dataDir, "coatwright.db"),
    uploadsDir: path.join(dataDir, "uploads"),
    outboxDir: path.join(dataDir, "outbox"),
    secretFile: path.join(dataDir, "secret"),
    backupDir: path.resolve(env.BACKUP_DIR ?? path.join(dataDir, "backups")),
    demoMode: env.DEMO_MODE ? env.DEMO_MODE === "1" : !env.SMTP_HOST,
  };
}
export type AppEnv = ReturnType<typeof readEnv>;
