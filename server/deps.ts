import type { Db } from "./db/client";
import type { AppLucia } from "./auth/lucia";
import type { Mailer } from "./mail/mailer";
import type { Payments } from "./payments/provider";
import type { SignInLimits } from "./auth/sign-in-limits";
import type { Logger } from "./log/logger";
import type { BackupService } from "./backups/backup-service";

/** Everything a router or service needs from the outside world; tests build their own. */
export type AppDeps = {
  db: Db;
  lucia: AppLucia;
  mailer: Mailer;
  /** Base URL for links in e-mails, without a trailing slash. */
  publicUrl: string;
  demoMode: boolean;
  outboxDir: string | null;
  dataDir: string;
  /** Where uploaded files are kept (DATA_DIR/uploads). */
  uploadsDir: string;
  now: () => number;
  rateLimits: { signIn: { perAddress: number; perAccount: number; windowMs: number }; passwordReset: number };
  /** The sign-in limiters built from rateLimits.signIn (the auth router uses them; a completed reset lifts an account's lock). */
  signInLimits: SignInLimits;
  /** Path of the built SPA (dist/) to serve, or null for API only. */
  clientDir: string | null;
  /** Server secret for signing links (customer-portal quote links). */
  appSecret: string;
  /** The card-payment provider's SDK (real or the local stand-in); null when online payments are not set up. */
  payments: Payments | null;
  log: Logger;
  /** Scheduled and on-demand backups of the database and uploads (main() starts the schedule). */
  backups: BackupService;
};
