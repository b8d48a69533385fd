import lighthouse from "lighthouse";
import * as chromeLauncher from "chrome-launcher";
import desktopConfig from "lighthouse/core/config/desktop-config.js";
import { computeMedianRun } from "lighthouse/core/lib/median-run.js";

type Lhr = NonNullable<Awaited<ReturnType<typeof lighthouse>>>["lhr"];

export type LighthouseScores = {
  /** False when no run of the page gave a result after its retries (then the scores are null). */
  ok: boolean;
  performance: number | null;
  accessibility: number | null;
  /** Every run's performance score, in run order (the reported one is the median run's). */
  performanceRuns: (number | null)[];
  /** Lighthouse's benchmarkIndex per run: how fast the machine was at that moment (it moves with other load). */
  benchmarkIndex: number[];
  notes: string[];
};

/** Lighthouse's default config: a mobile device with simulated throttling (slow 4G, 4x CPU slowdown). */
export const LIGHTHOUSE_PRESET = "default (mobile, simulated throttling)";

/** Runs per page and preset; the median run is reported, as Lighthouse's docs advise for noisy machines. */
export const LIGHTHOUSE_RUNS = Number(process.env.BENCH_LIGHTHOUSE_RUNS ?? 3);

async function runOnce(url: string, cookie: string | undefined, desktop: boolean): Promise<Lhr> {
  const chrome = await chromeLauncher.launch({ chromePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", chromeFlags: ["--headless", "--no-sandbox", "--disable-gpu"] });
  try {
    const result = await lighthouse(url, {
      port: chrome.port,
      output: "json",
      logLevel: "error",
      onlyCategories: ["performance", "accessibility"],
      ...(cookie ? { extraHeaders: { Cookie: cookie } } : {}),
    }, desktop ? desktopConfig : undefined);
    if (!result) throw new Error(`Lighthouse gave no result for ${url}`);
    return result.lhr;
  } finally {
    chrome.kill();
  }
}

const score = (lhr: Lhr, id: string) => (lhr.categories[id]?.score == null ? null : Math.round(lhr.categories[id]!.score! * 100));

/** Tries per Lighthouse run: a run that throws (e.g. "Some runs were missing an FCP value" on a busy machine) is retried twice. */
export const LIGHTHOUSE_TRIES = 3;

/** One run, retried up to twice when Lighthouse throws or reports a runtime error; null when every try failed. */
async function runWithRetries(url: string, cookie: string | undefined, desktop: boolean, problems: string[]): Promise<Lhr | null> {
  for (let attempt = 1; attempt <= LIGHTHOUSE_TRIES; attempt++) {
    try {
      const lhr = await runOnce(url, cookie, desktop);
      if (lhr.runtimeError) throw new Error(`${lhr.runtimeError.code}: ${lhr.runtimeError.message}`);
      if (lhr.audits["first-contentful-paint"]?.numericValue == null) throw new Error("no first contentful paint in this run");
      return lhr;
    } catch (error) {
      problems.push(`try ${attempt} failed: ${error instanceof Error ? error.message : String(error)}`);
    }
  }
  return null;
}

/**
 * Scores one page of the running app, 0-100, as the median of LIGHTHOUSE_RUNS runs (Lighthouse's own median-run
 * pick: the run closest to the median first paint and time to interactive). A signed-in page gets the session
 * cookie on every request. `notes` gives the median run's metrics and names the audits that lost points (e.g. text
 * compression), so a low score says why. Never throws: a page whose runs all failed is reported with ok: false.
 */
export async function scorePage(url: string, cookie?: string, desktop = false): Promise<LighthouseScores> {
  const runs: Lhr[] = [];
  const problems: string[] = [];
  for (let i = 0; i < LIGHTHOUSE_RUNS; i++) {
    const lhr = await runWithRetries(url, cookie, desktop, problems);
    if (lhr) runs.push(lhr);
  }
  if (runs.length === 0) return { ok: false, performance: null, accessibility: null, performanceRuns: [], benchmarkIndex: [], notes: [`every run failed: ${problems.join("; ")}`] };
  let median: Lhr;
  try {
    median = computeMedianRun(runs) as Lhr;
  } catch (error) {
    problems.push(`median pick failed (${error instanceof Error ? error.message : String(error)}), first run reported`);
    median = runs[0]!;
  }
  const { categories, audits } = median;
  const notes = (categories.performance?.auditRefs ?? [])
    .filter((ref) => ref.weight === 0 && audits[ref.id]?.details?.type === "opportunity" && (audits[ref.id]?.score ?? 1) < 0.9)
    .map((ref) => `${audits[ref.id]!.title}${audits[ref.id]!.displayValue ? ` (${audits[ref.id]!.displayValue})` : ""}`);
  const metrics = ["first-contentful-paint", "largest-contentful-paint", "total-blocking-time", "cumulative-layout-shift", "speed-index"]
    .map((id) => `${id.replace(/-/g, " ")} ${audits[id]?.displayValue ?? "?"}`);
  const failedA11y = (categories.accessibility?.auditRefs ?? []).filter((ref) => ref.weight > 0 && audits[ref.id]?.score === 0).map((ref) => `a11y: ${audits[ref.id]!.title}`);
  return {
    ok: true,
    performance: score(median, "performance"),
    accessibility: score(median, "accessibility"),
    performanceRuns: runs.map((r) => score(r, "performance")),
    benchmarkIndex: runs.map((r) => Math.round(r.environment.benchmarkIndex)),
    notes: [...metrics, ...notes, ...failedA11y, ...problems],
  };
}
