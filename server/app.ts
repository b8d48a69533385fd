import express from "express";
import helmet from "helmet";
import { existsSync } from "node:fs";
import { randomBytes } from "node:crypto";
import path from "node:path";
import type { Db } from "./db/client";
import type { AppDeps } from "./deps";
import { createLucia } from "./auth/lucia";
import { sessionMiddleware } from "./auth/session";
import { createSignInLimits } from "./auth/sign-in-limits";
import { originCheck } from "./http/origin-check";
import { errorHandler, notFoundHandler } from "./http/error-handler";
import { listRoutes } from "./http/route-list";
import type { Mailer } from "./mail/mailer";
import { createPayments, type PaymentsConfig } from "./payments/provider";
import { keepRawBody } from "./http/raw-body";
import { errorBodiesCarryRequestId, requestLog } from "./http/request-log";
import { silentLogger, type Logger } from "./log/logger";
import { createBackupService, type BackupSettings } from "./backups/backup-service";
import { gzippedAssets } from "./http/gzipped-assets";
import { authRouter } from "./modules/auth/auth.router";
import { healthRouter } from "./modules/health/health.router";
import { paintersRouter, usersRouter } from "./modules/users/users.router";
import { customersRouter } from "./modules/customers/customers.router";
import { jobsRouter } from "./modules/jobs/jobs.router";
import { outboxRouter } from "./modules/outbox/outbox.router";
import { mixRouter } from "./modules/mix/mix.router";
import { settingsRouter } from "./modules/settings/settings.router";
import { auditRouter } from "./modules/audit/audit.router";
import { complianceRouter } from "./modules/compliance/compliance.router";
import { solventUsesRouter } from "./modules/solvent-uses/solvent-uses.router";
import { dashboardRouter } from "./modules/dashboard/dashboard.router";

import { materialsRouter } from "./modules/materials/materials.router";
import { jobPlanRouter, plansRouter } from "./modules/plans/plans.router";
import { mixSheetsRouter } from "./modules/mix-sheets/mix-sheets.router";
import { uploadsRouter } from "./modules/uploads/uploads.router";
import { prepRouter } from "./modules/prep/prep.router";
import { jobColourRouter, panelsRouter } from "./modules/panels/panels.router";
import { boothRouter, coatLogsRouter } from "./modules/booth/booth.router";
import { quotesRouter } from "./modules/quotes/quotes.router";
import { messagesRouter } from "./modules/messages/messages.router";
import { portalRouter } from "./modules/portal/portal.router";
import { paymentsRouter } from "./modules/payments/payments.router";
import { boothsRouter, scheduleRouter } from "./modules/schedule/schedule.router";
import { gunsRouter } from "./modules/guns/guns.router";
import { finishRecordRouter } from "./modules/finish-record/finish-record.router";
import { inspectionRouter } from "./modules/intake/inspection.router";
import { panelSendRouter, portalColourRouter } from "./modules/intake/colour-sign-off.router";
import { changeOrdersRouter, jobChangeOrdersRouter, portalChangeOrdersRouter } from "./modules/change-orders/change-orders.router";

export type CreateAppOptions = {
  db: Db;
  mailer: Mailer;
  publicUrl?: string;
  demoMode?: boolean;
  outboxDir?: string | null;
  dataDir?: string;
  now?: () => number;
  rateLimits?: Partial<AppDeps["rateLimits"]>;
  clientDir?: string | null;
  trustProxy?: boolean;
  /** Secret for signed links; tests get a random one per app. */
  appSecret?: string;
  /** Card payments through the provider's SDK (the real service or the local stand-in); none when omitted. */
  payments?: PaymentsConfig | null;
  /** Where request lines and events go; nothing is logged when omitted (tests). */
  logger?: Logger;
  /** Backup folder, interval and how many to keep; defaults DATA_DIR/backups, 24 hours, 14. */
  backups?: Partial<BackupSettings>;
};

export function createApp(options: CreateAppOptions) {
  const dataDir = options.dataDir ?? "./data";
  const log = options.logger ?? silentLogger;
  const now = options.now ?? Date.now;
  const rateLimits: AppDeps["rateLimits"] = {
    signIn: { perAddress: 30, perAccount: 8, windowMs: 15 * 60_000 },
    passwordReset: 10,
    ...options.rateLimits,
  };
  const deps: AppDeps = {
    db: options.db,
    lucia: createLucia(options.db),
    mailer: options.mailer,
    publicUrl: (options.publicUrl ?? "http://localhost:3000").replace(/\/$/, ""),
    demoMode: options.demoMode ?? false,
    outboxDir: options.outboxDir ?? null,
    dataDir,
    uploadsDir: path.join(dataDir, "uploads"),
    now,
    rateLimits,
    signInLimits: createSignInLimits(rateLimits.signIn),
    clientDir: options.clientDir ?? null,
    appSecret: options.appSecret ?? randomBytes(32).toString("hex"),
    payments: options.payments ? createPayments(options.payments) : null,
    log,
    backups: createBackupService({
      dir: options.backups?.dir ?? path.join(dataDir, "backups"),
      everyHours: options.backups?.everyHours ?? 24,
      keep: options.backups?.keep ?? 14,
      sqlite: options.db.$client,
      uploadsDir: path.join(dataDir, "uploads"),
      log,
      now,
    }),
  };

  const app = express();
  app.disable("x-powered-by");
  // First, so every answer (static files and refusals included) carries X-Request-Id and gets its log line.
  app.use(requestLog(log));
  app.use(errorBodiesCarryRequestId);
  if (options.trustProxy) app.set("trust proxy", 1);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          "default-src": ["'self'"],
          "img-src": ["'self'", "data:", "blob:"],
          "style-src": ["'self'", "'unsafe-inline'"],
          "script-src": ["'self'"],
          "connect-src": ["'self'"],
          "font-src": ["'self'", "data:"],
          "object-src": ["'none'"],
          "frame-ancestors": ["'none'"],
          "form-action": ["'self'"],
          "upgrade-insecure-requests": null,
        },
      },
    }),
  );

  // API answers hold private shop and customer records: never stored by the browser or a proxy. With nothing
  // stored, an ETag (a hash of every body) would only cost time, so res.json sends none.
  app.set("etag", false);
  const api = express.Router();
  api.use((_req, res, next) => {
    res.set("Cache-Control", "no-store");
    next();
  });
  api.use(express.json({ limit: "200kb", verify: keepRawBody }));
  api.use(originCheck());
  api.use(sessionMiddleware(deps.lucia));
  const mounts: [string, express.Router][] = [
    ["/health", healthRouter(deps)],
    ["/auth", authRouter(deps)],
    ["/users", usersRouter(deps)],
    ["/painters", paintersRouter(deps)],
    ["/customers", customersRouter(deps)],
    ["/jobs", jobsRouter(deps)],
    ["/jobs", jobPlanRouter(deps)],
    ["/materials", materialsRouter(deps)],
    ["/plans", plansRouter(deps)],
    ["/mix-sheets", mixSheetsRouter(deps)],
    ["/outbox", outboxRouter(deps)],
    ["/mix", mixRouter(deps)],
    ["/settings", settingsRouter(deps)],
    ["/audit", auditRouter(deps)],
    ["/compliance", complianceRouter(deps)],
    ["/solvent-uses", solventUsesRouter(deps)],
    ["/dashboard", dashboardRouter(deps)],
    ["/uploads", uploadsRouter(deps)],
    ["/prep-records", prepRouter(deps)],
    ["/panels", panelsRouter(deps)],
    ["/jobs", jobColourRouter(deps)],
    ["/jobs", boothRouter(deps)],
    ["/coat-logs", coatLogsRouter(deps)],
    ["/quotes", quotesRouter(deps)],
    ["/messages", messagesRouter(deps)],
    ["/portal", portalRouter(deps)],
    ["/payments", paymentsRouter(deps)],
    ["/guns", gunsRouter(deps)],
    ["/booths", boothsRouter(deps)],
    ["/schedule", scheduleRouter(deps)],
    ["/jobs", finishRecordRouter(deps)],
    ["/jobs", inspectionRouter(deps)],
    ["/panels", panelSendRouter(deps)],
    ["/portal", portalColourRouter(deps)],
    ["/jobs", jobChangeOrdersRouter(deps)],
    ["/change-orders", changeOrdersRouter(deps)],
    ["/portal", portalChangeOrdersRouter(deps)],
  ];
  for (const [prefix, router] of mounts) api.use(prefix, router);
  api.use(notFoundHandler);
  api.use(errorHandler);
  app.use("/api", api);

  if (deps.clientDir && existsSync(path.join(deps.clientDir, "index.html"))) {
    const clientDir = deps.clientDir;
    // The service worker and the manifest are checked for updates on each visit: never served from a stale cache.
    app.get(["/sw.js", "/manifest.webmanifest"], (_req, res, next) => {
      res.set("Cache-Control", "no-cache");
      next();
    });
    app.use(gzippedAssets(clientDir));
    app.use(express.static(clientDir, { index: false, maxAge: "1h" }));
    app.get("/{*splat}", (_req, res) => {
      res.sendFile(path.join(clientDir, "index.html"));
    });
  }
  app.use(errorHandler);
  return Object.assign(app, { deps, routes: listRoutes("/api", mounts) });
}
