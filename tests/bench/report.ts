import type { FixedRateResult } from "./fixed-rate";
import type { QueryPlan } from "./query-plans";
import type { MixRecompute } from "./mix-recompute";

export const TARGETS = {
  /** Reads (jobs table, job detail) against their bare baseline, at saturation. */
  minReadRatio: 0.85,
  /** Writes (coat log, mix-sheet record) against the same statements as plain better-sqlite3 in one transaction. */
  minWriteRatio: 0.6,
  /** At a fixed 200 req/s, measured from each request's due time. */
  fixedRatePerSec: 200,
  maxReadP99Ms: 15,
  maxCoatP99Ms: 25,
  /** CPU per request at 100,000 jobs over 10,000 jobs. */
  maxGrowth: 1.5,
  maxBoothJsGzipBytes: 130 * 1024,
  minPerformance: 95,
  minAccessibility: 95,
  maxMixRecomputeP99Ms: 1,
};

export type RouteFigures = {
  route: string;
  reqPerSec: number;
  p50Ms: number;
  p99Ms: number;
  baselineReqPerSec: number | null;
  ratio: number | null;
  errors: number;
  non2xx: number;
  requests: number;
  /** The bare baseline's latencies in the same run (how far the machine itself is from the p99 target). */
  baselineP50Ms: number | null;
  baselineP99Ms: number | null;
  /** Server CPU time per request, app and baseline, and their ratio (baseline / app): a steadier view of the same ratio. */
  cpuUsPerRequest: number;
  baselineCpuUsPerRequest: number | null;
  cpuRatio: number | null;
};

export type Check = { name: string; target: string; value: string; pass: boolean };

export type WriteBaseline = { route: string; reqPerSec: number; baselineReqPerSec: number; ratio: number; cpuUsPerRequest: number; baselineCpuUsPerRequest: number; cpuRatio: number };
export type Growth = { route: string; cpuUsSmall: number; cpuUsLarge: number | null; factor: number | null };

export type BenchReport = {
  routes: RouteFigures[];
  writeBaselines: WriteBaseline[];
  fixedRate: FixedRateResult[];
  growth: Growth[];
  queryPlans: { small: QueryPlan[]; large: QueryPlan[] | null };
  /** At the larger size: a full online backup, and the VOC log of one year as CSV. */
  largeShop: { backupSeconds: number; backupBytes: number; vocExportSeconds: number; vocExportRows: number; dataset: Record<string, number> } | null;
  mixRecomputeP99Ms: number | null;
  mixRecompute: MixRecompute | null;
  /** Bytes the service worker precaches, when the build has one (0 when not). */
  precacheBytes: number;
  boothFirstVisitJsGzipBytes: number;
  boothFirstVisitCssGzipBytes: number;
  boothFirstVisitJsRawBytes: number;
  boothFirstVisitLargestJs: { file: string; gzipBytes: number }[];
  portalFirstVisitJsGzipBytes: number;
  split: { portalLoadsStaffChunks: string[]; boothLoadsPortalChunks: string[]; staffCodeChunks: number; portalCodeChunks: number };
  lighthouse: Record<string, { performance: number | null; accessibility: number | null }>;
  lighthouseDesktop: Record<string, { performance: number | null; accessibility: number | null }>;
  lighthouseNotes: Record<string, string[]>;
  /** Each run's performance score and the machine's benchmarkIndex, per page and preset (the tables show the median run). */
  lighthouseRuns: Record<string, { mobile: (number | null)[]; desktop: (number | null)[]; benchmarkIndex: number[] }>;
  /** Pages whose Lighthouse runs all failed, even after retries. */
  lighthouseFailed: string[];
  /** Steps that threw; the figures measured before them are still in the report. */
  failedSteps: string[];
  checks: Check[];
  environment: Record<string, unknown>;
  wallSeconds: number;
};

const READS = /^GET /;

/** Every target as a pass/fail line (a figure not measured yet is left out, not failed). */
export function checksFor(r: Partial<Omit<BenchReport, "checks" | "wallSeconds">>): Check[] {
  const checks: Check[] = [];
  for (const route of r.routes ?? []) {
    if (route.ratio != null && READS.test(route.route))
      checks.push({ name: `${route.route}: ratio to bare baseline`, target: `>= ${TARGETS.minReadRatio}`, value: route.ratio.toFixed(2), pass: route.ratio >= TARGETS.minReadRatio });
    checks.push({ name: `${route.route}: errors and non-2xx`, target: "0 and 0", value: `${route.errors} and ${route.non2xx}`, pass: route.errors === 0 && route.non2xx === 0 });
  }
  for (const w of r.writeBaselines ?? [])
    checks.push({ name: `${w.route}: ratio to bare write baseline`, target: `>= ${TARGETS.minWriteRatio}`, value: w.ratio.toFixed(2), pass: w.ratio >= TARGETS.minWriteRatio });
  for (const f of r.fixedRate ?? []) {
    const max = /coat/i.test(f.route) ? TARGETS.maxCoatP99Ms : TARGETS.maxReadP99Ms;
    checks.push({ name: `${f.route}: p99 at ${f.ratePerSec} req/s`, target: `<= ${max} ms`, value: `${f.p99Ms} ms`, pass: f.p99Ms <= max && f.errors === 0 && f.non2xx === 0 });
  }
  for (const g of r.growth ?? [])
    if (g.factor != null) checks.push({ name: `${g.route}: CPU per request, 100,000 jobs over 10,000`, target: `<= ${TARGETS.maxGrowth}x`, value: `${g.factor.toFixed(2)}x`, pass: g.factor <= TARGETS.maxGrowth });
  for (const [size, plans] of Object.entries(r.queryPlans ?? {})) {
    if (!plans) continue;
    const scans = plans.flatMap((p) => p.fullScans.map((s) => `${p.route}: ${s}`));
    checks.push({ name: `hot queries (${size} shop): full scans of growing tables`, target: "0", value: scans.length ? scans.join("; ") : "0", pass: scans.length === 0 });
  }
  if (r.mixRecomputeP99Ms != null)
    checks.push({ name: "mix-sheet recomputation in the browser: p99", target: `<= ${TARGETS.maxMixRecomputeP99Ms} ms`, value: `${r.mixRecomputeP99Ms} ms`, pass: r.mixRecomputeP99Ms <= TARGETS.maxMixRecomputeP99Ms });
  const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;
  if (r.boothFirstVisitJsGzipBytes != null)
    checks.push({ name: "booth card first visit: JS, gzip", target: `<= ${kb(TARGETS.maxBoothJsGzipBytes)}`, value: kb(r.boothFirstVisitJsGzipBytes), pass: r.boothFirstVisitJsGzipBytes <= TARGETS.maxBoothJsGzipBytes });
  if (r.split) {
    checks.push({ name: "portal first visit loads no chunk with staff code", target: "0", value: String(r.split.portalLoadsStaffChunks.length), pass: r.split.portalLoadsStaffChunks.length === 0 });
    checks.push({ name: "booth first visit loads no chunk with portal code", target: "0", value: String(r.split.boothLoadsPortalChunks.length), pass: r.split.boothLoadsPortalChunks.length === 0 });
  }
  for (const [page, s] of Object.entries(r.lighthouse ?? {})) {
    checks.push({ name: `Lighthouse ${page}: performance (mobile)`, target: `>= ${TARGETS.minPerformance}`, value: String(s.performance), pass: (s.performance ?? 0) >= TARGETS.minPerformance });
    checks.push({ name: `Lighthouse ${page}: accessibility`, target: `>= ${TARGETS.minAccessibility}`, value: String(s.accessibility), pass: (s.accessibility ?? 0) >= TARGETS.minAccessibility });
  }
  for (const page of r.lighthouseFailed ?? []) checks.push({ name: `Lighthouse ${page}`, target: "a result", value: "every run failed", pass: false });
  for (const stepName of r.failedSteps ?? []) checks.push({ name: `bench step: ${stepName}`, target: "ran", value: "threw", pass: false });
  return checks;
}

const pad = (cells: (string | number)[], widths: number[]) => cells.map((c, i) => String(c).padEnd(widths[i]!)).join("  ").trimEnd();

function table(head: string[], rows: (string | number)[][]) {
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => String(r[i]).length)));
  return [pad(head, widths), pad(widths.map((w) => "-".repeat(w)), widths), ...rows.map((r) => pad(r, widths))].join("\n");
}

export function printReport(r: Partial<BenchReport> & { checks: Check[] }, lighthousePreset: string) {
  const mark = (pass: boolean) => (pass ? "ok" : "FAIL");
  const env = r.environment ?? {};
  const lines: string[] = [""];
  if (r.routes?.length)
    lines.push(
      `Saturation on loopback, ${env.connections} connections, ${env.seconds} s measured per server and route after warm-ups on the same connections, app and`,
      "baseline in 4 alternating slices. CPU = server CPU time per request (from /proc), a steadier view of the ratio.",
      table(
        ["route", "req/s", "p50 ms", "p99 ms", "baseline req/s", "baseline p50/p99", "ratio", "CPU µs/req app/baseline", "CPU ratio", "errors", "non-2xx"],
        r.routes.map((x) => [
          x.route,
          x.reqPerSec,
          x.p50Ms,
          x.p99Ms,
          x.baselineReqPerSec ?? "-",
          x.baselineP99Ms == null ? "-" : `${x.baselineP50Ms}/${x.baselineP99Ms}`,
          x.ratio?.toFixed(2) ?? "-",
          x.baselineCpuUsPerRequest == null ? x.cpuUsPerRequest : `${x.cpuUsPerRequest}/${x.baselineCpuUsPerRequest}`,
          x.cpuRatio?.toFixed(2) ?? "-",
          x.errors,
          x.non2xx,
        ]),
      ),
      "At saturation p99 only restates throughput (Little's law); the fixed-rate table below is the latency a shop feels.",
      "",
    );
  if (r.fixedRate?.length)
    lines.push(
      "Fixed rate (open loop: each request due at its time whether or not earlier answers came back; latency from the due time):",
      table(["route", "req/s", "requests", "p50 ms", "p99 ms", "max ms", "errors", "non-2xx"], r.fixedRate.map((f) => [f.route, f.ratePerSec, f.sent, f.p50Ms, f.p99Ms, f.maxMs, f.errors, f.non2xx])),
      "",
    );
  if (r.growth?.length)
    lines.push(
      "Growth: server CPU per request at 10,000 and at 100,000 jobs:",
      table(["route", "CPU µs small", "CPU µs large", "factor"], r.growth.map((g) => [g.route, g.cpuUsSmall, g.cpuUsLarge ?? "-", g.factor?.toFixed(2) ?? "-"])),
      "",
    );
  if (r.largeShop)
    lines.push(
      `Large shop (${Object.entries(r.largeShop.dataset).map(([t, n]) => `${t} ${n}`).join(", ")}): full online backup ${r.largeShop.backupSeconds.toFixed(1)} s (${(r.largeShop.backupBytes / 1048576).toFixed(0)} MiB);`,
      `  VOC log of one year as CSV ${r.largeShop.vocExportSeconds.toFixed(2)} s (${r.largeShop.vocExportRows} batches)`,
      "",
    );
  for (const [size, plans] of Object.entries(r.queryPlans ?? {})) {
    if (!plans) continue;
    lines.push(`Query plans (${size} shop), one line per distinct statement of the measured routes:`);
    for (const p of plans) lines.push(`  ${p.route} | ${p.sql.slice(0, 110)}${p.sql.length > 110 ? "…" : ""}`, ...p.plan.map((d) => `      ${d}`));
    lines.push("");
  }
  if (r.mixRecompute)
    lines.push(`Mix-sheet recomputation in Chromium: ${r.mixRecompute.runs} runs, p50 ${r.mixRecompute.p50Ms} ms, p99 ${r.mixRecompute.p99Ms} ms, max ${r.mixRecompute.maxMs} ms (timer resolution ${r.mixRecompute.timerResolutionMs} ms)`, "");
  if (r.boothFirstVisitJsGzipBytes != null)
    lines.push(
      `Client, first visit (gzip level 9): booth card JS ${(r.boothFirstVisitJsGzipBytes / 1024).toFixed(1)} KB, CSS ${((r.boothFirstVisitCssGzipBytes ?? 0) / 1024).toFixed(1)} KB; portal JS ${((r.portalFirstVisitJsGzipBytes ?? 0) / 1024).toFixed(1)} KB; precache ${((r.precacheBytes ?? 0) / 1024).toFixed(1)} KB`,
      `  largest booth card JS: ${(r.boothFirstVisitLargestJs ?? []).map((f) => `${f.file.replace("assets/", "")} ${(f.gzipBytes / 1024).toFixed(1)} KB`).join(", ")}`,
      r.split ? `Route split: ${r.split.staffCodeChunks} chunks with staff code and ${r.split.portalCodeChunks} with portal code; the portal loaded ${r.split.portalLoadsStaffChunks.length} of the first, the booth card ${r.split.boothLoadsPortalChunks.length} of the second` : "",
      "",
    );
  if (r.lighthouse && Object.keys(r.lighthouse).length) {
    const runs = r.lighthouseRuns ?? {};
    const indexes = Object.values(runs).flatMap((x) => x.benchmarkIndex);
    lines.push(
      table(
        ["Lighthouse page", `performance (${lighthousePreset})`, "accessibility", "performance (desktop preset)", "accessibility (desktop)"],
        Object.keys(r.lighthouse).map((p) => [p, r.lighthouse![p]!.performance ?? "-", r.lighthouse![p]!.accessibility ?? "-", r.lighthouseDesktop?.[p]?.performance ?? "-", r.lighthouseDesktop?.[p]?.accessibility ?? "-"]),
      ),
      `  every run's score: ${Object.entries(runs).map(([p, x]) => `${p} mobile ${x.mobile.join("/")}, desktop ${x.desktop.join("/")}`).join("; ")}`,
      indexes.length ? `  machine speed (Lighthouse benchmarkIndex) over the runs: ${Math.min(...indexes)}–${Math.max(...indexes)}` : "",
      ...Object.entries(r.lighthouseNotes ?? {}).map(([p, notes]) => `  ${p} (mobile, median run): ${notes.join("; ")}`),
      "",
    );
  }
  lines.push(table(["target", "wanted", "measured", ""], r.checks.map((c) => [c.name, c.target, c.value, mark(c.pass)])), "");
  lines.push(`${r.checks.filter((c) => c.pass).length} of ${r.checks.length} targets met; wall time ${(r.wallSeconds ?? 0).toFixed(0)} s`);
  console.log(lines.join("\n"));
}
