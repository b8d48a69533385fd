import { readFileSync } from "node:fs";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { chromium, type Browser } from "playwright-core";
import { isPortalCode, isStaffCode } from "../support/code-areas";
import { sessionIdOf } from "./capture";

/** Debian's chromium with the flags tests/e2e/browser.ts uses on this machine's closed network. */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
  });
}

export type FirstVisit = { files: string[]; jsGzipBytes: number; cssGzipBytes: number; jsRawBytes: number; largest: { file: string; gzipBytes: number }[] };

/** gzip level 9 (the most a server or CDN would squeeze out of a static file). */
const gzipSize = (b: Buffer) => gzipSync(b, { level: 9 }).length;

/**
 * A first visit to `pathname` in a fresh context (empty cache) already signed in with `cookie`: every same-origin
 * script and stylesheet it downloads until the network is quiet and `ready` is on screen, summed after gzip.
 */
export async function firstVisit(browser: Browser, baseUrl: string, pathname: string, cookie: string, ready: (page: import("playwright-core").Page) => Promise<unknown>): Promise<FirstVisit> {
  const context = await browser.newContext({ viewport: { width: 820, height: 1180 } }); // a tablet in portrait
  await context.addCookies([{ name: "cw_session", value: sessionIdOf(cookie), url: baseUrl }]);
  const page = await context.newPage();
  const bodies: Promise<{ url: string; type: string; bytes: Buffer }>[] = [];
  page.on("response", (res) => {
    const type = res.request().resourceType();
    if (res.url().startsWith(baseUrl) && (type === "script" || type === "stylesheet") && res.ok()) bodies.push(res.body().then((bytes) => ({ url: res.url(), type, bytes })));
  });
  try {
    await page.goto(baseUrl + pathname, { waitUntil: "networkidle" });
    await ready(page);
    await page.waitForLoadState("networkidle");
    const got = (await Promise.all(bodies)).map((g) => ({ ...g, file: new URL(g.url).pathname.replace(/^\//, ""), gzipBytes: gzipSize(g.bytes) }));
    const sum = (type: string, size: (g: (typeof got)[number]) => number) => got.filter((g) => g.type === type).reduce((n, g) => n + size(g), 0);
    return {
      files: got.map((g) => g.file),
      jsGzipBytes: sum("script", (g) => g.gzipBytes),
      cssGzipBytes: sum("stylesheet", (g) => g.gzipBytes),
      jsRawBytes: sum("script", (g) => g.bytes.length),
      largest: got
        .filter((g) => g.type === "script")
        .sort((a, b) => b.gzipBytes - a.gzipBytes)
        .slice(0, 6)
        .map(({ file, gzipBytes }) => ({ file, gzipBytes })),
    };
  } finally {
    await context.close();
  }
}

/**
 * From dist/.vite/chunk-modules.json: the chunks that hold staff-screen code and those that hold portal code (the
 * same module rules as the route-splitting browser test).
 */
export function areaChunks(clientDir: string) {
  const modules = JSON.parse(readFileSync(path.join(clientDir, ".vite/chunk-modules.json"), "utf8")) as Record<string, string[]>;
  const holding = (isArea: (module: string) => boolean) => new Set(Object.entries(modules).filter(([, ids]) => ids.some(isArea)).map(([file]) => file));
  return { staff: holding(isStaffCode), portal: holding(isPortalCode) };
}
