import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import { ARTEFACTS, launch, navNames, newPage, seriousViolations, signIn } from "./browser";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** The numbers in a chart's screen-reader table, by row header. */
async function tableRows(page: Page, testId: string) {
  return page.getByTestId(testId).locator("table tbody tr").evaluateAll((rows) =>
    rows.map((r) => Array.from(r.querySelectorAll("th, td")).map((c) => (c.textContent ?? "").trim())),
  );
}

describe("dashboard", () => {
  it("the owner sees the charts drawn from the demo data, with their numbers in tables", async () => {
    const { page, errors, close } = await newPage(browser);
    await signIn(page, baseUrl, "owner");
    expect((await navNames(page))[0]).toBe("Dashboard");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Dashboard" }).click();
    await page.waitForURL(/\/dashboard$/);
    await page.getByRole("heading", { level: 1, name: "Dashboard" }).waitFor();
    await page.getByTestId("chart-jobs-by-stage").locator(".recharts-bar-rectangle").first().waitFor();

    // Bars are drawn for jobs by stage and revenue by month.
    expect(await page.getByTestId("chart-jobs-by-stage").locator(".recharts-bar-rectangle path").count()).toBeGreaterThan(3);
    expect(await page.getByTestId("chart-revenue").locator(".recharts-bar-rectangle path").count()).toBeGreaterThan(0);
    expect(await page.getByTestId("chart-material-spend").locator(".recharts-bar-rectangle path").count()).toBeGreaterThan(0);
    expect(await page.getByTestId("chart-booth-hours").locator(".recharts-bar-rectangle path").count()).toBeGreaterThan(0);

    // The accessible tables carry the same figures: stage counts are whole numbers that add up to the demo jobs.
    const stages = await tableRows(page, "chart-jobs-by-stage");
    expect(stages.length).toBeGreaterThan(3);
    const jobsTotal = stages.reduce((sum, [, count]) => sum + Number(count), 0);
    expect(jobsTotal).toBeGreaterThan(10);
    const revenue = await tableRows(page, "chart-revenue");
    expect(revenue).toHaveLength(12);
    expect(revenue.some(([, deposits]) => deposits !== "$0.00")).toBe(true);
    for (const [, deposits, delivered] of revenue) {
      expect(deposits).toMatch(/^-?\$[\d,]+\.\d{2}$/);
      expect(delivered).toMatch(/^-?\$[\d,]+\.\d{2}$/);
    }
    // The tables are named for screen readers, and "Show numbers" shows them to everyone.
    expect(await page.getByRole("table", { name: "Jobs by stage" }).count()).toBe(1);
    await page.getByTestId("chart-revenue").getByRole("button", { name: "Show numbers" }).click();
    expect(await page.getByRole("table", { name: "Revenue by month" }).isVisible()).toBe(true);

    // Deposits as dollars.
    expect(await page.getByRole("heading", { name: "Deposits" }).count()).toBe(1);
    expect(await page.locator("dd").filter({ hasText: /^\$[\d,]+\.\d{2}$/ }).count()).toBeGreaterThanOrEqual(3);

    // The machine: the backup the server took when it started, and the free space in its data folder.
    const system = page.getByRole("region", { name: "Backups and disk" });
    expect(await system.count()).toBe(1);
    await expect.poll(() => system.getByTestId("last-backup").innerText(), { timeout: 10_000 }).not.toBe("None yet");
    expect(await system.getByTestId("free-space").innerText()).toMatch(/^\d+(\.\d)? (KB|MB|GB|TB)$/);
    expect(await system.innerText()).toMatch(/with \d+ uploaded files/);

    expect(await seriousViolations(page)).toEqual([]);
    await page.screenshot({ path: path.join(ARTEFACTS, "dashboard-owner.png"), fullPage: true });
    expect(errors).toEqual([]);
    await close();
  });

  it("the estimator sees the jobs part and no money", async () => {
    const { page, errors, close } = await newPage(browser, { width: 820, height: 1180 });
    await signIn(page, baseUrl, "estimator");
    const names = await navNames(page);
    expect(names[0]).toBe("Dashboard");
    expect(names).not.toContain("Audit");
    await page.goto(`${baseUrl}/dashboard`);
    await page.getByTestId("chart-jobs-by-stage").locator(".recharts-bar-rectangle").first().waitFor();
    expect(await page.getByRole("heading", { name: "Overdue" }).count()).toBe(1);
    expect(await page.getByRole("heading", { name: "Due this week" }).count()).toBe(1);
    expect(await page.getByTestId("chart-revenue").count()).toBe(0);
    expect(await page.getByTestId("chart-material-spend").count()).toBe(0);
    expect(await page.getByRole("heading", { name: "Deposits" }).count()).toBe(0);
    expect(await page.getByRole("heading", { name: "Backups and disk" }).count()).toBe(0);
    expect(await page.locator("main").innerText()).not.toMatch(/\$\d/);
    expect(errors).toEqual([]);
    await close();
  });
});

describe("VOC log", () => {
  it("the owner sees the demo batches, the totals and the limits note", async () => {
    const { page, errors, close } = await newPage(browser);
    await signIn(page, baseUrl, "owner");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "VOC log" }).click();
    await page.waitForURL(/\/compliance/);
    const batches = page.getByRole("table", { name: "VOC batches" });
    await batches.waitFor();
    expect(await batches.locator("tbody tr").count()).toBeGreaterThan(0);
    expect(await batches.locator("tbody tr").first().innerText()).toMatch(/g\/L/);
    const main = await page.locator("main").innerText();
    expect(main).toContain("No VOC limit is built into Coatwright");
    expect(main).toContain("air permit");
    expect(main).toContain("1 lb/gal = 119.826427 g/L");
    expect(main).toContain("1 lb = 0.45359237 kg");
    // The CSV link carries the range on screen.
    const year = new Date().getFullYear();
    expect(await page.getByRole("link", { name: /Download CSV/ }).getAttribute("href")).toBe(`/api/compliance/export.csv?from=${year}-01-01&to=${year}-12-31`);

    expect(await seriousViolations(page)).toEqual([]);
    await page.screenshot({ path: path.join(ARTEFACTS, "voc-log-owner.png") });
    expect(errors).toEqual([]);
    await close();
  });
});

describe("audit trail and settings", () => {
  it("the owner pages the audit trail through the URL, and both screens pass axe", async () => {
    const { page, errors, close } = await newPage(browser);
    await signIn(page, baseUrl, "owner");
    await page.goto(`${baseUrl}/audit?pageSize=10`);
    const table = page.getByRole("table", { name: "Audit trail" });
    await table.locator("tbody tr").first().waitFor();
    expect(await table.locator("tbody tr").count()).toBe(10);
    await page.getByRole("button", { name: "Next" }).click();
    await page.waitForURL((u) => u.searchParams.get("page") === "2");
    await expect.poll(() => page.getByRole("navigation", { name: "Pagination" }).innerText(), { timeout: 10_000 }).toMatch(/11–20 of \d+ entries/);
    await expect.poll(() => table.getAttribute("aria-busy")).toBeNull();
    expect(await seriousViolations(page)).toEqual([]);

    // The "who" filter is a searchable picker: type, pick from the keyboard, and the choice goes into the URL.
    const who = page.getByRole("combobox", { name: "Who" });
    await who.click();
    await who.pressSequentially("dana");
    const people = page.getByRole("listbox", { name: "Who" });
    await expect.poll(() => people.getByRole("option").allInnerTexts()).toEqual([expect.stringMatching(/^Dana /)]);
    await who.press("Enter");
    await page.waitForURL((u) => Boolean(u.searchParams.get("who")));
    await expect.poll(() => who.inputValue()).toMatch(/^Dana /);
    const chosen = await who.inputValue();
    await page.reload();
    await expect.poll(() => page.getByRole("combobox", { name: "Who" }).inputValue()).toBe(chosen);
    expect(await seriousViolations(page)).toEqual([]);

    await page.goto(`${baseUrl}/settings`);
    await page.getByRole("button", { name: "Save settings" }).waitFor();
    expect(await page.locator("main").innerText()).toContain("No VOC limit is built into Coatwright");
    expect(await seriousViolations(page)).toEqual([]);
    expect(errors).toEqual([]);
    await close();
  });
});
