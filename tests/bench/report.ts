export const TARGETS = {
  minRatio: 0.6,
  maxP99Ms: 25,
  maxBoothJsGzipBytes: 180 * 1024,
  minPerformance: 90,
  minAccessibility: 95,
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

export type BenchReport = {
  routes: RouteFigures[];
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
  checks: Check[];
  environment: Record<string, unknown>;
  wallSeconds: number;
};

/** Every target as a pass/fail line. */
export function checksFor(r: Omit<BenchReport, "checks" | "wallSeconds">): Check[] {
  const checks: Check[] = [];
  for (const route of r.routes) {
    if (route.ratio != null) checks.push({ name: `${route.route}: ratio to bare baseline`, target: `>= ${TARGETS.minRatio}`, value: route.ratio.toFixed(2), pass: route.ratio >= TARGETS.minRatio });
    checks.push({ name: `${route.route}: p99 at 50 connections`, target: `<= ${TARGETS.maxP99Ms} ms`, value: `${route.p99Ms} ms`, pass: route.p99Ms <= TARGETS.maxP99Ms });
    checks.push({ name: `${route.route}: errors and non-2xx`, target: "0 and 0", value: `${route.errors} and ${route.non2xx}`, pass: route.errors === 0 && route.non2xx === 0 });
  }
  const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;
  checks.push({ name: "booth card first visit: JS, gzip", target: `<= ${kb(TARGETS.maxBoothJsGzipBytes)}`, value: kb(r.boothFirstVisitJsGzipBytes), pass: r.boothFirstVisitJsGzipBytes <= TARGETS.maxBoothJsGzipBytes });
  checks.push({ name: "portal first visit loads no chunk with staff code", target: "0", value: String(r.split.portalLoadsStaffChunks.length), pass: r.split.portalLoadsStaffChunks.length === 0 });
  checks.push({ name: "booth first visit loads no chunk with portal code", target: "0", value: String(r.split.boothLoadsPortalChunks.length), pass: r.split.boothLoadsPortalChunks.length === 0 });
  for (const [page, s] of Object.entries(r.lighthouse)) {
    checks.push({ name: `Lighthouse ${page}: performance`, target: `>= ${TARGETS.minPerformance}`, value: String(s.performance), pass: (s.performance ?? 0) >= TARGETS.minPerformance });
    checks.push({ name: `Lighthouse ${page}: accessibility`, target: `>= ${TARGETS.minAccessibility}`, value: String(s.accessibility), pass: (s.accessibility ?? 0) >= TARGETS.minAccessibility });
  }
  return checks;
}

const pad = (cells: (string | number)[], widths: number[]) => cells.map((c, i) => String(c).padEnd(widths[i]!)).join("  ").trimEnd();

function table(head: string[], rows: (string | number)[][]) {
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => String(r[i]).length)));
  return [pad(head, widths), pad(widths.map((w) => "-".repeat(w)), widths), ...rows.map((r) => pad(r, widths))].join("\n");
}

export function printReport(r: BenchReport, lighthousePreset: string) {
  const mark = (pass: boolean) => (pass ? "ok" : "FAIL");
  const lines = [
    "",
    `Load on loopback, ${r.environment.connections} connections, ${r.environment.seconds} s measured per server and route after warm-ups on the same connections;`,
    "reads: app and baseline in 4 alternating slices. CPU = server CPU time per request (from /proc), a steadier view of the ratio.",
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
    `At ${r.environment.connections} connections each waiting for its answer, the mean latency is ${r.environment.connections} / (req/s): a p99 of ${TARGETS.maxP99Ms} ms needs well over ${Math.round(Number(r.environment.connections) / (TARGETS.maxP99Ms / 1000))} req/s.`,
    "The coat-log figures leave out each connection's warm-up; fresh connections opened under full write load waited longest.",
    "",
    `Client, first visit (gzip level 9): booth card JS ${(r.boothFirstVisitJsGzipBytes / 1024).toFixed(1)} KB, CSS ${(r.boothFirstVisitCssGzipBytes / 1024).toFixed(1)} KB; portal JS ${(r.portalFirstVisitJsGzipBytes / 1024).toFixed(1)} KB`,
    `  largest booth card JS: ${r.boothFirstVisitLargestJs.map((f) => `${f.file.replace("assets/", "")} ${(f.gzipBytes / 1024).toFixed(1)} KB`).join(", ")}`,
    `Route split: ${r.split.staffCodeChunks} chunks with staff code and ${r.split.portalCodeChunks} with portal code in the build; the portal loaded ${r.split.portalLoadsStaffChunks.length} of the first, the booth card ${r.split.boothLoadsPortalChunks.length} of the second`,
    "",
    table(
      ["Lighthouse page", `performance (${lighthousePreset})`, "accessibility", "performance (desktop preset)", "accessibility (desktop)"],
      Object.keys(r.lighthouse).map((p) => [p, r.lighthouse[p]!.performance ?? "-", r.lighthouse[p]!.accessibility ?? "-", r.lighthouseDesktop[p]?.performance ?? "-", r.lighthouseDesktop[p]?.accessibility ?? "-"]),
    ),
    `  median of ${Object.values(r.lighthouseRuns)[0]?.mobile.length ?? 0} runs per page and preset; every run's score: ${Object.entries(r.lighthouseRuns)
      .map(([p, runs]) => `${p} mobile ${runs.mobile.join("/")}, desktop ${runs.desktop.join("/")}`)
      .join("; ")}`,
    `  machine speed (Lighthouse benchmarkIndex) over the runs: ${Math.min(...Object.values(r.lighthouseRuns).flatMap((x) => x.benchmarkIndex))}–${Math.max(...Object.values(r.lighthouseRuns).flatMap((x) => x.benchmarkIndex))}`,
    ...Object.entries(r.lighthouseNotes).map(([p, notes]) => `  ${p} (mobile, median run): ${notes.join("; ")}`),
    "",
    table(["target", "wanted", "measured", ""], r.checks.map((c) => [c.name, c.target, c.value, mark(c.pass)])),
    "",
    `${r.checks.filter((c) => c.pass).length} of ${r.checks.length} targets met; wall time ${r.wallSeconds.toFixed(0)} s`,
  ];
  console.log(lines.join("\n"));
}

