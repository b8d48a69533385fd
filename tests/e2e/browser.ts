import { chromium, type Browser, type Page } from "playwright-core";
import path from "node:path";
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

export { expect };
