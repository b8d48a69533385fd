import path from "node:path";
import { build } from "vite";
import type { Browser } from "playwright-core";

export type MixRecompute = { runs: number; p50Ms: number; p99Ms: number; maxMs: number; timerResolutionMs: number };

/**
 * A full mix-sheet recomputation (browser/mix-recompute-entry.ts) run in Chromium, the engine the painter's tablet
 * uses: the entry is bundled with Vite as the app is, loaded into a blank page, warmed up, then timed one
 * recomputation at a time. Chromium rounds performance.now() (100 µs without cross-origin isolation), which is
 * reported beside the figures.
 */
export async function mixRecomputeInBrowser(browser: Browser, runs = 20_000): Promise<MixRecompute> {
  const out = await build({
    configFile: false,
    logLevel: "error",
    resolve: { alias: { "@shared": path.resolve(import.meta.dirname, "../../shared") } },
    build: {
      write: false,
      minify: true,
      lib: { entry: path.resolve(import.meta.dirname, "browser/mix-recompute-entry.ts"), formats: ["iife"], name: "mixRecompute" },
    },
  });
  const outputs = (Array.isArray(out) ? out : [out]) as { output: { type: string; code?: string }[] }[];
  const code = outputs.flatMap((o) => o.output).find((o) => o.type === "chunk")?.code;
  if (!code) throw new Error("the recompute bundle is empty");
  const context = await browser.newContext();
  try {
    const page = await context.newPage();
    await page.goto("about:blank");
    await page.addScriptTag({ content: code });
    await page.evaluate(() => (window as unknown as { __recompute: (n: number) => number[] }).__recompute(3000));
    const times = (await page.evaluate((n) => (window as unknown as { __recompute: (n: number) => number[] }).__recompute(n), runs)).sort((a, b) => a - b);
    const resolution = await page.evaluate(() => {
      let smallest = Infinity;
      let last = performance.now();
      for (let i = 0; i < 200_000; i++) {
        const t = performance.now();
        if (t > last) {
          smallest = Math.min(smallest, t - last);
          last = t;
        }
      }
      return smallest;
    });
    const at = (q: number) => Math.round(times[Math.min(times.length - 1, Math.floor(q * times.length))]! * 1000) / 1000;
    return { runs, p50Ms: at(0.5), p99Ms: at(0.99), maxMs: at(1), timerResolutionMs: Math.round(resolution * 1000) / 1000 };
  } finally {
    await context.close();
  }
}
