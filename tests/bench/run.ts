/**
 * `npm run bench`: load and speed of Coatwright on a large invented shop, measured as ratios to a bare baseline.
 * Builds the client into a temp folder, seeds 10,000 jobs / 100,000 coat logs / 20,000 mix sheets, runs the real
 * app and a bare Express + better-sqlite3 baseline in child processes, drives them with autocannon from here,
 * weighs the booth card's first visit in chromium and scores three pages with Lighthouse. Prints a table and writes
 * the same figures as JSON to BENCH_OUT (default data/bench.json). A script, not a test: it never fails a build.
 */
import Database from "better-sqlite3";
import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { cpus, loadavg, tmpdir } from "node:os";
import path from "node:path";
import { captureSql, signIn } from "./capture";
import { areaChunks, firstVisit, launchChromium } from "./client-weight";
import { LIGHTHOUSE_PRESET, LIGHTHOUSE_RUNS, scorePage } from "./lighthouse";
import { compareGet, LOAD, loadCoatLogs } from "./load";
import { checksFor, printReport, type BenchReport, type RouteFigures } from "./report";
import { addSprayPool, seedLargeShop } from "./seed/shop";
import { ROOT, startChild, type Child } from "./servers/processes";
import { OPEN_STAGES } from "../../shared/domain/stages";

const started = Date.now();
const out = path.resolve(ROOT, process.env.BENCH_OUT ?? "data/bench.json");
const work = mkdtempSync(path.join(tmpdir(), "cw-bench-"));
const dataDir = path.join(work, "data");
const clientDir = path.join(work, "client");
const EMAIL = { owner: "owner@demo.coatwright.test", painter: "painter@demo.coatwright.test", customer: "customer@demo.coatwright.test" };
const step = (what: string) => console.log(`[${((Date.now() - started) / 1000).toFixed(0).padStart(3)} s] ${what}`);
const children: Child[] = [];
const loadStart = loadavg()[0]!;

try {
  step("building the client (vite build, with its manifest)");
  const build = spawnSync(path.join(ROOT, "node_modules/.bin/vite"), ["build", "--outDir", clientDir, "--emptyOutDir", "--manifest", "--logLevel", "error"], { cwd: ROOT, stdio: "inherit" });
  if (build.status !== 0) throw new Error("vite build failed");

  step("seeding the large shop (migrations, demo seed, bulk rows)");
  const { dbFile, totals } = await seedLargeShop(dataDir);
  step(`seeded: ${Object.entries(totals).map(([t, n]) => `${t} ${n}`).join(", ")}`);
  const db = new Database(dbFile, { readonly: true });
  const detailJob = db.prepare("select j.id from jobs j where j.stage = 'delivered' and (select count(*) from job_items i where i.job_id = j.id) = 3 order by j.id desc limit 1").pluck().get() as number;
  const boothJob = db
    .prepare("select j.id from jobs j join users u on u.id = j.assigned_painter_id where u.email = ? and j.stage = 'in_booth' and j.sprayed_plan_version_id is not null order by j.id desc limit 1")
    .pluck()
    .get(EMAIL.painter) as number;
  db.close();

  const env = { DATA_DIR: dataDir, BENCH_CLIENT_DIR: clientDir, SIGNIN_LIMIT_PER_ADDRESS: "1000" };
  const reads = [
    { name: "GET /api/jobs (page of 50, open stages, by due date)", url: `/api/jobs?page=1&pageSize=50&sort=dueDate&stage=${OPEN_STAGES.join(",")}`, email: EMAIL.owner },
    { name: `GET /api/jobs/:id (job detail)`, url: `/api/jobs/${detailJob}`, email: EMAIL.owner },
  ];
  step("capturing the SQL each read route runs (app with SQL tracing, one request each)");
  const captured = await captureSql(env, work, reads);
  const baselineFile = path.join(work, "baseline.json");
  writeFileSync(baselineFile, JSON.stringify(captured.routes));

  const app = await startChild("tests/bench/servers/app-server.ts", env);
  children.push(app);
  const baseline = await startChild("tests/bench/servers/baseline-server.ts", { BENCH_BASELINE: baselineFile, BENCH_DB: dbFile }, "/");
  children.push(baseline);

  const routes: RouteFigures[] = [];
  for (const r of reads) {
    const statements = captured.routes.find((c) => c.name === r.name)!.statements.length;
    step(`load: ${r.name}, real app and bare baseline (${statements} statements) in turn`);
    const { app: real, baseline: bare } = await compareGet(app, baseline, r.url, captured.cookies.get(r.email)!);
    routes.push({
      route: r.name,
      ...real,
      baselineReqPerSec: bare.reqPerSec,
      ratio: Math.round((real.reqPerSec / bare.reqPerSec) * 100) / 100,
      baselineP50Ms: bare.p50Ms,
      baselineP99Ms: bare.p99Ms,
      baselineCpuUsPerRequest: bare.cpuUsPerRequest,
      cpuRatio: Math.round((bare.cpuUsPerRequest / real.cpuUsPerRequest) * 100) / 100,
    });
  }
  await baseline.stop();

  step("adding 600 jobs ready for the booth (after the read routes, so the jobs table was not skewed)");
  const pool = addSprayPool(dbFile, EMAIL.painter, 600);
  const painterCookie = await signIn(app.url, EMAIL.painter);
  step("load: POST /api/coat-logs (log the next coat), real app");
  const coats = await loadCoatLogs(app, painterCookie, pool);
  routes.push({ route: "POST /api/coat-logs (log a coat)", ...coats, baselineReqPerSec: null, ratio: null, baselineP50Ms: null, baselineP99Ms: null, baselineCpuUsPerRequest: null, cpuRatio: null });

  step(`client weight: first visit to /booth/${boothJob} (painter) and /portal (customer) in a fresh chromium context`);
  const customerCookie = await signIn(app.url, EMAIL.customer);
  const ownerCookie = captured.cookies.get(EMAIL.owner)!;
  const browser = await launchChromium();
  const heading = (p: import("playwright-core").Page) => p.getByRole("heading", { level: 1 }).first().waitFor();
  const [booth, portal] = await (async () => {
    try {
      return [await firstVisit(browser, app.url, `/booth/${boothJob}`, painterCookie, heading), await firstVisit(browser, app.url, "/portal", customerCookie, heading)];
    } finally {
      await browser.close();
    }
  })();
  const areas = areaChunks(clientDir);

  const pages = { "sign-in": ["/sign-in", undefined], "jobs table": ["/jobs", ownerCookie], "booth card": [`/booth/${boothJob}`, painterCookie] } as const;
  const lighthouse: BenchReport["lighthouse"] = {};
  const lighthouseDesktop: BenchReport["lighthouse"] = {};
  const lighthouseNotes: BenchReport["lighthouseNotes"] = {};
  const lighthouseRuns: BenchReport["lighthouseRuns"] = {};
  for (const [page, [url, cookie]] of Object.entries(pages)) {
    step(`Lighthouse: ${page} (${url}), ${LIGHTHOUSE_PRESET} and desktop preset, ${LIGHTHOUSE_RUNS} runs each`);
    const mobile = await scorePage(app.url + url, cookie);
    const desktop = await scorePage(app.url + url, cookie, true);
    lighthouse[page] = { performance: mobile.performance, accessibility: mobile.accessibility };
    lighthouseDesktop[page] = { performance: desktop.performance, accessibility: desktop.accessibility };
    lighthouseNotes[page] = mobile.notes;
    lighthouseRuns[page] = { mobile: mobile.performanceRuns, desktop: desktop.performanceRuns, benchmarkIndex: [...mobile.benchmarkIndex, ...desktop.benchmarkIndex] };
  }

  const figures: Omit<BenchReport, "checks" | "wallSeconds"> = {
    routes,
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
    lighthouse,
    lighthouseDesktop,
    lighthouseNotes,
    lighthouseRuns,
    environment: {
      date: new Date().toISOString(),
      node: process.version,
      cpus: cpus().length,
      cpuModel: cpus()[0]?.model,
      loadAverageAtStart: loadStart,
      loadAverageAtEnd: loadavg()[0],
      chromium: spawnSync("/usr/bin/chromium", ["--version"], { encoding: "utf8" }).stdout.trim(),
      connections: LOAD.connections,
      warmupSeconds: LOAD.warmupSeconds,
      seconds: LOAD.seconds,
      dataset: totals,
      detailJobId: detailJob,
      boothJobId: boothJob,
      gzip: "node:zlib level 9, per file",
      lighthousePreset: LIGHTHOUSE_PRESET,
      sizeUnit: "KB = 1024 bytes",
    },
  };
  const report: BenchReport = { ...figures, checks: checksFor(figures), wallSeconds: (Date.now() - started) / 1000 };
  mkdirSync(path.dirname(out), { recursive: true });
  writeFileSync(out, `${JSON.stringify(report, null, 2)}\n`);
  printReport(report, "mobile");
  console.log(`Figures written to ${path.relative(process.cwd(), out) || out}`);
} finally {
  for (const child of children) await child.stop();
  if (!process.env.BENCH_KEEP) rmSync(work, { recursive: true, force: true });
}
