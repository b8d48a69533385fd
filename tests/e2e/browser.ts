import { chromium, type Browser, type Page } from "playwright-core";
import path from "node:path";
import { readFileSync } from "node:fs";
import { expect } from "vitest";

export const DEMO_PASSWORD = "paintshop-demo";
export const demoEmail = (role: "owner" | "estimator" | "painter" | "customer") => `${role}@demo.coatwright.test`;
export const ARTEFACTS = path.resolve(import.meta.dirname, "../../test-results");

/** Debian's chromium, headless, with the flags this machine's closed network needs. */
export function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
}

/** API requests each page has in flight (see waitForQuiet). */
const apiInFlight = new WeakMap<Page, Set<unknown>>();

/**
 * A fresh page that fails the test on any console error or uncaught exception. It runs with reduced motion (as a
 * user who asked for it would), so the app's colour transitions take no time; pass `motion: "full"` to see them.
 * `serviceWorkers: "block"` keeps the offline app's service worker out, for a test that slows the network with
 * page.route (requests the service worker answers from its cache never reach page.route).
 */
export async function newPage(
  browser: Browser,
  viewport = { width: 1280, height: 800 },
  { motion = "reduce", serviceWorkers = "allow" }: { motion?: "reduce" | "full"; serviceWorkers?: "allow" | "block" } = {},
) {
  const context = await browser.newContext({ viewport, reducedMotion: motion === "reduce" ? "reduce" : "no-preference", serviceWorkers });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error" && !/401 \(Unauthorized\)/.test(m.text())) errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(String(e)));
  const inFlight = new Set<unknown>();
  apiInFlight.set(page, inFlight);
  page.on("request", (r) => {
    if (new URL(r.url()).pathname.startsWith("/api/")) inFlight.add(r);
  });
  // An answer counts once its headers arrive (a body nobody reads never "finishes"); the two quiet turns in
  // waitForQuiet leave time for the body and the render it causes.
  page.on("response", (r) => inFlight.delete(r.request()));
  page.on("requestfinished", (r) => inFlight.delete(r));
  page.on("requestfailed", (r) => inFlight.delete(r));
  return { page, errors, close: () => context.close() };
}

/**
 * Waits until the page is still: no API request in flight and no finite animation or colour transition running,
 * twice in a row 100 ms apart (a query that lands can start a transition, a transition can end in a refetch).
 * Run before anything that measures what is on screen, such as axe's colour-contrast rule.
 */
export async function waitForQuiet(page: Page, timeout = 10_000) {
  const inFlight = apiInFlight.get(page);
  const busy = async () =>
    (inFlight?.size ?? 0) +
    (await page.evaluate(
      () => document.getAnimations().filter((a) => a.playState === "running" && a.effect?.getTiming().iterations !== Infinity).length,
    ));
  const deadline = Date.now() + timeout;
  let quietTurns = 0;
  while (quietTurns < 2) {
    if (Date.now() > deadline) throw new Error(`the page did not settle within ${timeout} ms (${await busy()} requests or animations still running: ${[...(inFlight ?? [])].map((r) => (r as { url(): string }).url()).join(", ")})`);
    quietTurns = (await busy()) === 0 ? quietTurns + 1 : 0;
    await new Promise((r) => setTimeout(r, 100));
  }
}

export async function signIn(page: Page, baseUrl: string, role: "owner" | "estimator" | "painter" | "customer") {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("Email").fill(demoEmail(role));
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
}

export async function navNames(page: Page) {
  const nav = page.getByRole("navigation", { name: "Main" });
  await nav.waitFor();
  return (await nav.getByRole("link").allInnerTexts()).map((t) => t.trim());
}

const AXE_SOURCE = path.resolve(import.meta.dirname, "../../node_modules/axe-core/axe.min.js");
let axeSource: string | undefined;
type AxeViolation = { id: string; impact: string | null; help: string; nodes: { target: unknown[] }[] };

/**
 * axe-core on the page as it is; returns the serious and critical findings as "id (impact): help at targets"
 * (minor and moderate ones are not failures). Checks that axe really looked at the page: a script that did not
 * load would also give "no violations".
 */
export async function seriousViolations(page: Page) {
  axeSource ??= readFileSync(AXE_SOURCE, "utf8");
  // The app's CSP (script-src 'self') refuses page.addScriptTag's inline script; an evaluate runs outside it.
  if (!(await page.evaluate(() => "axe" in window))) await page.evaluate(axeSource);
  const result = await page.evaluate(async () => {
    type Axe = { run: (context: Document, options: object) => Promise<{ violations: AxeViolation[]; passes: unknown[] }> };
    const axe = (window as unknown as { axe: Axe }).axe;
    // Every node of every violation; passes and the rest keep one node per rule, which makes the run much faster.
    return axe.run(document, { resultTypes: ["violations"] });
  });
  expect(result.passes.length, "axe-core ran on the page").toBeGreaterThan(10);
  return result.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.map((n) => JSON.stringify(n.target)).join(", ")}`);
}

/**
 * Records every Content-Security-Policy violation on the page, across navigations: the browser's
 * `securitypolicyviolation` events (through an init script and a binding, both outside the page's CSP) and any
 * console message about the policy. Call before the first navigation.
 */
export async function recordCspViolations(page: Page) {
  const seen: string[] = [];
  await page.exposeBinding("__cwCspViolation", (_source, text: string) => {
    seen.push(`${page.url()}: ${text}`);
  });
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => {
      const report = (window as unknown as { __cwCspViolation: (text: string) => void }).__cwCspViolation;
      void report(`${e.effectiveDirective} blocked ${e.blockedURI || "(inline)"} at ${e.sourceFile || "?"}:${e.lineNumber}`);
    });
  });
  page.on("console", (m) => {
    if (/Content[ -]Security[ -]Policy/i.test(m.text())) seen.push(`${page.url()}: console ${m.type()}: ${m.text()}`);
  });
  return seen;
}

export { expect };
