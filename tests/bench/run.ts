/**
 * `npm run bench`: load and speed of Coatwright on a large invented shop, measured as ratios to a bare baseline.
 * Builds the client into a temp folder, seeds 10,000 jobs / 100,000 coat logs / 20,000 mix sheets, runs the real
 * app and a bare Express + better-sqlite3 baseline in child processes and drives them from here: reads and writes at
 * saturation against the baseline, then a fixed rate; weighs the booth card's first visit in chromium, times the mix
 * engine in the browser and scores five pages with Lighthouse; then seeds the shop ten times over (BENCH_GROWTH=0
 * skips it) to see how the cost per request grows. Every figure is written to BENCH_OUT (default data/bench.json) as
 * soon as it is measured, so a step that fails loses nothing measured before it. A script, not a test.
 */
import Database from "better-sqlite3";
import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { cpus, loadavg, tmpdir } from "node:os";
import path from "node:path";
import { captureSql, signIn, type CaptureRoute } from "./capture";
import { areaChunks, firstVisit, launchChromium } from "./client-weight";
import { fixedRate } from "./fixed-rate";
import { LIGHTHOUSE_PRESET, LIGHTHOUSE_RUNS, scorePage } from "./lighthouse";
import { coatQueue, compareGet, LOAD_REASON, compareWrite, LOAD, merge, run, writeLoad, type WriteRequest } from "./load";
import { mixRecomputeInBrowser } from "./mix-recompute";
import { queryPlans } from "./query-plans";
import { checksFor, printReport, type BenchReport, type RouteFigures } from "./report";
import { addDraftSheets, addSprayPool, LARGE, seedLargeShop, TARGET, type ShopSize } from "./seed/shop";
import { ROOT, startChild, type Child } from "./servers/processes";
import type { Vary } from "./servers/baseline-server";
import { OPEN_STAGES } from "../../shared/domain/stages";
import { loadAppSecret } from "../../server/app-secret";
import { signQuoteLink } from "../../server/modules/portal/portal-link";
import { takeBackup } from "../../server/backups/take-backup";

const started = Date.now();
const out = path.resolve(ROOT, process.env.BENCH_OUT ?? "data/bench.json");
const work = mkdtempSync(path.join(tmpdir(), "cw-bench-"));
const clientDir = path.join(work, "client");
const EMAIL = { owner: "owner@demo.coatwright.test", painter: "painter@demo.coatwright.test", customer: "customer@demo.coatwright.test" };
const step = (what: string) => console.log(`[${((Date.now() - started) / 1000).toFixed(0).padStart(4)} s] ${what}`);
const children: Child[] = [];
const loadStart = loadavg()[0]!;

/** The report as it stands; written out after every step. */
const report: Partial<BenchReport> = {
  routes: [],
  writeBaselines: [],
  fixedRate: [],
  growth: [],
  queryPlans: { small: [], large: null },
  largeShop: null,
  mixRecomputeP99Ms: null,
  mixRecompute: null,
  precacheBytes: 0,
  lighthouse: {},
  lighthouseDesktop: {},
  lighthouseNotes: {},
  lighthouseRuns: {},
  lighthouseFailed: [],
  failedSteps: [],
  environment: {
    date: new Date().toISOString(),
    node: process.version,
    cpus: cpus().length,
    cpuModel: cpus()[0]?.model,
    loadAverageAtStart: loadStart,
    chromium: spawnSync("/usr/bin/chromium", ["--version"], { encoding: "utf8" }).stdout.trim(),
    connections: LOAD.connections,
    warmupSeconds: LOAD.warmupSeconds,
    seconds: LOAD.seconds,
    gzip: "node:zlib level 9, per file",
    lighthousePreset: LIGHTHOUSE_PRESET,
    sizeUnit: "KB = 1024 bytes",
  },
};

function save() {
  const full = { ...report, checks: checksFor(report), wallSeconds: (Date.now() - started) / 1000 };
  full.environment = { ...full.environment, loadAverageAtEnd: loadavg()[0] };
  mkdirSync(path.dirname(out), { recursive: true });
  writeFileSync(out, `${JSON.stringify(full, null, 2)}\n`);
  return full;
}

/** Runs one step; a step that throws is recorded, and the bench goes on with the next one. */
async function attempt<T>(name: string, fn: () => Promise<T>): Promise<T | undefined> {
  try {
    return await fn();
  } catch (error) {
    console.error(`[bench] ${name} failed: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`);
    report.failedSteps!.push(name);
    return undefined;
  } finally {
    save();
  }
}

const routeFigures = (route: string, real: ReturnType<typeof merge>, bare: ReturnType<typeof merge> | null): RouteFigures => ({
  route,
  ...real,
  baselineReqPerSec: bare?.reqPerSec ?? null,
  ratio: bare ? Math.round((real.reqPerSec / bare.reqPerSec) * 100) / 100 : null,
  baselineP50Ms: bare?.p50Ms ?? null,
  baselineP99Ms: bare?.p99Ms ?? null,
  baselineCpuUsPerRequest: bare?.cpuUsPerRequest ?? null,
  cpuRatio: bare ? Math.round((bare.cpuUsPerRequest / real.cpuUsPerRequest) * 100) / 100 : null,
});

type Shop = { dataDir: string; dbFile: string; totals: Record<string, number>; detailJob: number; boothJob: number; env: Record<string, string> };

async function seedShop(name: string, size: ShopSize): Promise<Shop> {
  const dataDir = path.join(work, name);
  const { dbFile, totals } = await seedLargeShop(dataDir, Date.now(), size);
  const db = new Database(dbFile, { readonly: true });
  const detailJob = db.prepare("select j.id from jobs j where j.stage = 'delivered' and (select count(*) from job_items i where i.job_id = j.id) = 3 order by j.id desc limit 1").pluck().get() as number;
  const boothJob = db
    .prepare("select j.id from jobs j join users u on u.id = j.assigned_painter_id where u.email = ? and j.stage = 'in_booth' and j.sprayed_plan_version_id is not null order by j.id desc limit 1")
    .pluck()
    .get(EMAIL.painter) as number;
  db.close();
  return { dataDir, dbFile, totals, detailJob, boothJob, env: { DATA_DIR: dataDir, BENCH_CLIENT_DIR: clientDir, SIGNIN_LIMIT_PER_ADDRESS: "1000" } };
}

const readRoutes = (shop: Shop) => [
  { name: "GET /api/jobs (page of 50, open stages, by due date)", url: `/api/jobs?page=1&pageSize=50&sort=dueDate&stage=${OPEN_STAGES.join(",")}`, email: EMAIL.owner },
  { name: "GET /api/jobs/:id (job detail)", url: `/api/jobs/${shop.detailJob}`, email: EMAIL.owner },
];
const COAT = "POST /api/coat-logs (log a coat)";
const RECORD = "POST /api/mix-sheets/:id/record (record a mixed batch)";
const recordRequest = (id: number): WriteRequest => ({ path: `/api/mix-sheets/${id}/record`, body: JSON.stringify({ lines: [] }) });

type WriteSide = { coats: ReturnType<typeof coatQueue>; nextRecord: () => WriteRequest; recordsLeft: () => number };

/**
 * Writes of a shop: jobs ready for the booth and their draft mix sheets, split between the app and the baseline (each
 * writes records of its own, one per request); one job and two sheets are kept aside for capturing the SQL.
 */
function writePool(shop: Shop, jobs: number) {
  const pool = addSprayPool(shop.dbFile, EMAIL.painter, jobs);
  const captureJob = pool.pop()!;
  const drafts = addDraftSheets(shop.dbFile, pool, EMAIL.painter);
  const captureSheets = [drafts.pop()!, drafts.pop()!];
  const side = (jobsOf: typeof pool, sheets: number[]): WriteSide => {
    let d = 0;
    return { coats: coatQueue(jobsOf), nextRecord: () => recordRequest(sheets[d++]!), recordsLeft: () => sheets.length - d };
  };
  const half = Math.floor(pool.length / 2);
  const halfSheets = Math.floor(drafts.length / 2);
  const coatCapture: CaptureRoute = {
    name: COAT,
    method: "POST",
    email: EMAIL.painter,
    url: "/api/coat-logs",
    // Coat 1 moves the job to the booth (a stage move): the measured coat is an ordinary one, coat 2.
    warm: { url: "/api/coat-logs", body: { jobId: captureJob.jobId, ...captureJob.coats[0], boothTemp: 21, tempUnit: "C", humidityPct: 48, timingOverrideReason: LOAD_REASON } },
    body: { jobId: captureJob.jobId, ...captureJob.coats[1], boothTemp: 21, tempUnit: "C", humidityPct: 48, timingOverrideReason: LOAD_REASON },
  };
  const recordCapture: CaptureRoute = { name: RECORD, method: "POST", email: EMAIL.painter, url: `/api/mix-sheets/${captureSheets[0]}/record`, warm: { url: `/api/mix-sheets/${captureSheets[1]}/record`, body: { lines: [] } }, body: { lines: [] } };
  const db = new Database(shop.dbFile, { readonly: true });
  const lineIds = db.prepare("select id from mix_sheet_lines where mix_sheet_id = ? order by position, id").pluck().all(captureSheets[0]) as number[];
  db.close();
  const vary: Record<string, Vary> = {
    [COAT]: { kind: "coat", jobId: captureJob.jobId, layerId: captureJob.coats[1]!.layerId, versionId: captureJob.versionId },
    [RECORD]: { kind: "record", sheetId: captureSheets[0]!, lineIds },
  };
  return { app: side(pool.slice(0, half), drafts.slice(0, halfSheets)), baseline: side(pool.slice(half), drafts.slice(halfSheets)), captures: [coatCapture, recordCapture], vary };
}

/** Server CPU per request of a route at saturation (app only): for the growth figures. */
async function cpuPerRequest(app: Child, cookie: string, get?: string, post?: () => WriteRequest, budget = 1_000_000) {
  const seconds = Math.max(4, LOAD.seconds / 2);
  const r = get ? await run(app, { url: app.url + get, duration: LOAD.warmupSeconds + seconds, headers: { cookie } }, LOAD.warmupSeconds) : await writeLoad(app, cookie, post!, seconds, LOAD.warmupSeconds, budget);
  return merge([r]).cpuUsPerRequest;
}

try {
  step("building the client (vite build, with its manifest)");
  const build = spawnSync(path.join(ROOT, "node_modules/.bin/vite"), ["build", "--outDir", clientDir, "--emptyOutDir", "--manifest", "--logLevel", "error"], { cwd: ROOT, stdio: "inherit" });
  if (build.status !== 0) throw new Error("vite build failed");
  report.precacheBytes = precacheBytes(clientDir);

  step("seeding the shop (migrations, demo seed, bulk rows)");
  const small = await seedShop("small", TARGET);
  report.environment = { ...report.environment, dataset: small.totals, detailJobId: small.detailJob, boothJobId: small.boothJob };
  step(`seeded: ${Object.entries(small.totals).map(([t, n]) => `${t} ${n}`).join(", ")}`);

  const reads = readRoutes(small);
  step("capturing the SQL each read route runs (app with SQL tracing, one request each)");
  const capturedReads = await captureSql(small.env, work, reads);
  const app = await startChild("tests/bench/servers/app-server.ts", small.env);
  children.push(app);
  const ownerCookie = capturedReads.cookies.get(EMAIL.owner)!;

  await attempt("reads against the baseline", async () => {
    const file = path.join(work, "baseline-reads.json");
    writeFileSync(file, JSON.stringify(capturedReads.routes));
    const baseline = await startChild("tests/bench/servers/baseline-server.ts", { BENCH_BASELINE: file, BENCH_DB: small.dbFile }, "/");
    try {
      for (const r of reads) {
        step(`load: ${r.name}, real app and bare baseline in turn`);
        const { app: real, baseline: bare } = await compareGet(app, baseline, r.url, ownerCookie);
        report.routes!.push(routeFigures(r.name, real, bare));
        save();
      }
    } finally {
      await baseline.stop();
    }
  });

  step("adding 2,000 jobs ready for the booth and their draft mix sheets (after the reads, so the jobs table was not skewed)");
  const writes = writePool(small, 2000);
  const painterCookie = await signIn(app.url, EMAIL.painter);
  const capturedWrites = await attempt("capturing the SQL of the write routes", () => captureSql(small.env, work, writes.captures));
  report.queryPlans!.small = queryPlans(small.dbFile, [...capturedReads.routes, ...(capturedWrites?.routes ?? [])]);
  save();

  if (capturedWrites)
    await attempt("writes against the baseline", async () => {
      const file = path.join(work, "baseline-writes.json");
      writeFileSync(file, JSON.stringify(capturedWrites.routes.map((r) => ({ ...r, vary: writes.vary[r.name] }))));
      const baseline = await startChild("tests/bench/servers/baseline-server.ts", { BENCH_BASELINE: file, BENCH_DB: small.dbFile }, "/");
      try {
        for (const name of [COAT, RECORD]) {
          step(`load: ${name}, real app and the same statements in one transaction on plain better-sqlite3, in turn`);
          const pick = (w: WriteSide) => (name === COAT ? { next: w.coats.next, left: w.coats.left } : { next: w.nextRecord, left: w.recordsLeft });
          const { app: real, baseline: bare } = await compareWrite(app, baseline, pick(writes.app).next, pick(writes.baseline).next, painterCookie, pick(writes.app).left() - 200);
          const figures = routeFigures(name, real, bare);
          report.routes!.push(figures);
          report.writeBaselines!.push({ route: name, reqPerSec: real.reqPerSec, baselineReqPerSec: bare.reqPerSec, ratio: figures.ratio!, cpuUsPerRequest: real.cpuUsPerRequest, baselineCpuUsPerRequest: bare.cpuUsPerRequest, cpuRatio: figures.cpuRatio! });
          save();
        }
      } finally {
        await baseline.stop();
      }
    });

  await attempt("fixed-rate latency", async () => {
    const rate = 200;
    for (const r of reads) {
      step(`fixed rate: ${r.name} at ${rate} req/s`);
      report.fixedRate!.push(await fixedRate(r.name, app.url, rate, LOAD.seconds, () => ({ path: r.url, headers: { cookie: ownerCookie } })));
      save();
    }
    step(`fixed rate: ${COAT} at ${rate} req/s`);
    report.fixedRate!.push(
      await fixedRate(COAT, app.url, rate, LOAD.seconds, () => ({ ...writes.app.coats.next(), method: "POST", headers: { cookie: painterCookie, "content-type": "application/json" } })),
    );
  });

  const growthRoutes: { route: string; get?: string; post?: () => WriteRequest }[] = [
    ...reads.map((r) => ({ route: r.name, get: r.url })),
    { route: COAT, post: writes.app.coats.next },
    { route: RECORD, post: writes.app.nextRecord },
  ];
  await attempt("CPU per request at 10,000 jobs", async () => {
    for (const g of growthRoutes) {
      step(`CPU per request at 10,000 jobs: ${g.route}`);
      const fromSaturation = report.routes!.find((r) => r.route === g.route)?.cpuUsPerRequest;
      report.growth!.push({ route: g.route, cpuUsSmall: fromSaturation ?? (await cpuPerRequest(app, g.get ? ownerCookie : painterCookie, g.get, g.post)), cpuUsLarge: null, factor: null });
    }
  });

  await attempt("mix engine in the browser", async () => {
    step("mix-sheet recomputation in Chromium");
    const browser = await launchChromium();
    try {
      report.mixRecompute = await mixRecomputeInBrowser(browser);
      report.mixRecomputeP99Ms = report.mixRecompute.p99Ms;
    } finally {
      await browser.close();
    }
  });

  const customerCookie = await signIn(app.url, EMAIL.customer);
  await attempt("client weight", async () => {
    step(`client weight: first visit to /booth/${small.boothJob} (painter) and /portal (customer) in a fresh chromium context`);
    const browser = await launchChromium();
    const heading = (p: import("playwright-core").Page) => p.getByRole("heading", { level: 1 }).first().waitFor();
    try {
      const booth = await firstVisit(browser, app.url, `/booth/${small.boothJob}`, painterCookie, heading);
      const portal = await firstVisit(browser, app.url, "/portal", customerCookie, heading);
      const areas = areaChunks(clientDir);
      Object.assign(report, {
        boothFirstVisitJsGzipBytes: booth.jsGzipBytes,
        boothFirstVisitCssGzipBytes: booth.cssGzipBytes,
        boothFirstVisitJsRawBytes: booth.jsRawBytes,
        boothFirstVisitLargestJs: booth.largest,
        portalFirstVisitJsGzipBytes: portal.jsGzipBytes,
        split: {
          portalLoadsStaffChunks: portal.files.filter((f) => areas.staff.has(f)),
          boothLoadsPortalChunks: booth.files.filter((f) => areas.portal.has(f)),
          staffCodeChunks: areas.staff.size,
          portalCodeChunks: areas.portal.size,
        },
      });
    } finally {
      await browser.close();
    }
  });

  // The customer's pages from an e-mail: the signed quote link and their job page.
  const db = new Database(small.dbFile, { readonly: true });
  const openQuote = db
    .prepare(
      "select q.id from quotes q join jobs j on j.id = q.job_id join users u on u.customer_id = j.customer_id where u.email = ? and exists (select 1 from quote_versions v where v.quote_id = q.id and v.status in ('sent', 'viewed')) order by q.id limit 1",
    )
    .pluck()
    .get(EMAIL.customer) as number | undefined;
  const customerJob = db.prepare("select j.id from jobs j join users u on u.customer_id = j.customer_id where u.email = ? order by j.id limit 1").pluck().get(EMAIL.customer) as number;
  db.close();
  const secret = loadAppSecret(undefined, path.join(small.dataDir, "secret"));
  const pages: Record<string, [string, string | undefined]> = {
    "sign-in": ["/sign-in", undefined],
    "jobs table": ["/jobs", ownerCookie],
    "booth card": [`/booth/${small.boothJob}`, painterCookie],
    ...(openQuote ? { "quote link (customer, from e-mail)": [`/portal/link/${signQuoteLink(secret, openQuote, Date.now() + 7 * 86_400_000)}`, undefined] as [string, undefined] } : {}),
    "portal job (customer)": [`/portal/jobs/${customerJob}`, customerCookie],
  };
  for (const [page, [url, cookie]] of Object.entries(pages)) {
    await attempt(`Lighthouse ${page}`, async () => {
      step(`Lighthouse: ${page} (${url.slice(0, 60)}), ${LIGHTHOUSE_PRESET} and desktop preset, ${LIGHTHOUSE_RUNS} runs each`);
      const mobile = await scorePage(app.url + url, cookie);
      const desktop = await scorePage(app.url + url, cookie, true);
      if (!mobile.ok || !desktop.ok) report.lighthouseFailed!.push(`${page}${mobile.ok ? " (desktop)" : desktop.ok ? " (mobile)" : ""}`);
      report.lighthouse![page] = { performance: mobile.performance, accessibility: mobile.accessibility };
      report.lighthouseDesktop![page] = { performance: desktop.performance, accessibility: desktop.accessibility };
      report.lighthouseNotes![page] = mobile.notes;
      report.lighthouseRuns![page] = { mobile: mobile.performanceRuns, desktop: desktop.performanceRuns, benchmarkIndex: [...mobile.benchmarkIndex, ...desktop.benchmarkIndex] };
    });
  }
  await app.stop();

  if (process.env.BENCH_GROWTH !== "0")
    await attempt("the shop ten times over", async () => {
      step(`seeding the shop ten times over (${LARGE.jobs} jobs, ${LARGE.coatLogs} coat logs, ${LARGE.mixSheets} mix sheets)`);
      const large = await seedShop("large", LARGE);
      step(`seeded: ${Object.entries(large.totals).map(([t, n]) => `${t} ${n}`).join(", ")}`);
      const largeWrites = writePool(large, 2000);
      const bigApp = await startChild("tests/bench/servers/app-server.ts", large.env);
      children.push(bigApp);
      try {
        const owner = await signIn(bigApp.url, EMAIL.owner);
        const painter = await signIn(bigApp.url, EMAIL.painter);
        const largeReads = readRoutes(large);
        for (const g of report.growth!) {
          step(`CPU per request at 100,000 jobs: ${g.route}`);
          const read = largeReads.find((r) => r.name === g.route);
          const cpu = read
            ? await cpuPerRequest(bigApp, owner, read.url)
            : await cpuPerRequest(bigApp, painter, undefined, g.route === COAT ? largeWrites.app.coats.next : largeWrites.app.nextRecord, (g.route === COAT ? largeWrites.app.coats.left() : largeWrites.app.recordsLeft()) - 200);
          g.cpuUsLarge = cpu;
          g.factor = Math.round((cpu / g.cpuUsSmall) * 100) / 100;
          save();
        }
        report.queryPlans!.large = queryPlans(large.dbFile, [...capturedReads.routes, ...(capturedWrites?.routes ?? [])]);
        step("timing a full online backup and a year's VOC log export at this size");
        // The same backup as the server's schedule and `npm run backup`: online copy, integrity check, uploads beside it.
        const source = new Database(large.dbFile, { fileMustExist: true });
        source.pragma("busy_timeout = 5000");
        let t = performance.now();
        const backup = await takeBackup({ sqlite: source, uploadsDir: path.join(large.dataDir, "uploads"), backupDir: path.join(work, "large-backups"), kind: "manual" }).finally(() => source.close());
        const backupSeconds = (performance.now() - t) / 1000;
        const to = new Date().toISOString().slice(0, 10);
        const from = new Date(Date.now() - 365 * 86_400_000).toISOString().slice(0, 10);
        t = performance.now();
        const csv = await (await fetch(`${bigApp.url}/api/compliance/export.csv?from=${from}&to=${to}`, { headers: { cookie: owner } })).text();
        const vocExportSeconds = (performance.now() - t) / 1000;
        report.largeShop = { backupSeconds, backupBytes: backup.totalBytes, vocExportSeconds, vocExportRows: csv.trim().split("\n").length - 1, dataset: large.totals };
      } finally {
        await bigApp.stop();
      }
    });

  const final = save();
  printReport(final, "mobile");
  console.log(`Figures written to ${path.relative(process.cwd(), out) || out}`);
} finally {
  for (const child of children) await child.stop();
  save();
  if (!process.env.BENCH_KEEP) rmSync(work, { recursive: true, force: true });
}

/** Bytes of the files a service worker precaches, read from its manifest in the build (0 when the build has none). */
function precacheBytes(dir: string): number {
  const sw = readdirSync(dir).find((f) => /^(sw|service-worker)\.js$/.test(f));
  if (!sw) return 0;
  const text = readFileSync(path.join(dir, sw), "utf8");
  const urls = [...text.matchAll(/url:"([^"]+)"/g)].map((m) => m[1]!);
  return urls.reduce((n, u) => {
    try {
      return n + statSync(path.join(dir, u)).size;
    } catch {
      return n;
    }
  }, 0);
}
