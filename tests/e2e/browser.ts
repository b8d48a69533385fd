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

/** A fresh page that fails the test on any console error or uncaught exception. */
export async function newPage(browser: Browser, viewport = { width: 1280, height: 800 }) {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error" && !/401 \(Unauthorized\)/.test(m.text())) errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(String(e)));
  return { page, errors, close: () => context.close() };
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
