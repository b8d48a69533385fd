import lighthouse from "lighthouse";
import * as chromeLauncher from "chrome-launcher";
import desktopConfig from "lighthouse/core/config/desktop-config.js";

export type LighthouseScores = { performance: number | null; accessibility: number | null; notes: string[] };

/** Lighthouse's default config: a mobile device with simulated throttling (slow 4G, 4x CPU slowdown). */
export const LIGHTHOUSE_PRESET = "default (mobile, simulated throttling)";

/**
 * Scores one page of the running app, 0-100. A signed-in page gets the session cookie on every request. `notes`
 * names the performance audits that lost points (e.g. text compression), so a low score says why.
 */
export async function scorePage(url: string, cookie?: string, desktop = false): Promise<LighthouseScores> {
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
    const { categories, audits } = result.lhr;
    const score = (id: string) => (categories[id]?.score == null ? null : Math.round(categories[id]!.score! * 100));
    const notes = (categories.performance?.auditRefs ?? [])
      .filter((ref) => ref.weight === 0 && audits[ref.id]?.details?.type === "opportunity" && (audits[ref.id]?.score ?? 1) < 0.9)
      .map((ref) => `${audits[ref.id]!.title}${audits[ref.id]!.displayValue ? ` (${audits[ref.id]!.displayValue})` : ""}`);
    const metrics = ["first-contentful-paint", "largest-contentful-paint", "total-blocking-time", "cumulative-layout-shift", "speed-index"]
      .map((id) => `${id.replace(/-/g, " ")} ${audits[id]?.displayValue ?? "?"}`);
    const failedA11y = (categories.accessibility?.auditRefs ?? []).filter((ref) => ref.weight > 0 && audits[ref.id]?.score === 0).map((ref) => `a11y: ${audits[ref.id]!.title}`);
    return { performance: score("performance"), accessibility: score("accessibility"), notes: [...metrics, ...notes, ...failedA11y] };
  } finally {
    chrome.kill();
  }
}
