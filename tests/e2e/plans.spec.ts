import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import path from "node:path";
import { ARTEFACTS, launch, newPage, signIn } from "./browser";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

// US gallon = 231 in³ = 3785.411784 mL exactly (NIST Handbook 44, App. C).
const GALLON_ML = 3785.411784;

/** The clear's stock (in gallons, its purchase unit) as its material page shows it. */
async function clearStock(page: Page, materialId: number): Promise<number> {
  await page.goto(`${baseUrl}/materials/${materialId}`);
  const total = page.getByRole("table", { name: "Stock by lot" }).locator("tfoot td").first();
  await total.waitFor();
  return Number((await total.innerText()).replace(/[^\d.]/g, ""));
}

describe("finish plans and mix sheets", () => {
  it("an estimator builds a job's plan from a template, makes and records a mix sheet, and the clear's stock falls", async () => {
    const { page, errors, close } = await newPage(browser, { width: 1280, height: 1000 });
    await signIn(page, baseUrl, "estimator");

    // A fresh job with one item, so no other spec's data is involved.
    const customers = await (await page.request.get(`${baseUrl}/api/customers?pageSize=1`)).json();
    const job = await (await page.request.post(`${baseUrl}/api/jobs`, { data: { customerId: customers.items[0].id, title: `Plan E2E tank ${Date.now()}` } })).json();
    expect((await page.request.post(`${baseUrl}/api/jobs/${job.id}/items`, { data: { name: "Fuel tank", substrate: "steel", surfaceArea: 0.6, areaUnit: "m2" } })).status()).toBe(201);
    const clear = (await (await page.request.get(`${baseUrl}/api/materials?q=S5-B02`)).json())[0];
    expect(clear.purchaseUnit).toBe("gallon");
    const before = await clearStock(page, clear.id);

    // The job page leads to its plan; start it from a template.
    await page.goto(`${baseUrl}/jobs/${job.id}`);
    await page.getByRole("link", { name: "Plan this job" }).click();
    await page.waitForURL(new RegExp(`/jobs/${job.id}/plan$`));
    await page.getByLabel("Start from").selectOption({ label: "Candy over metallic ground" });
    await page.getByRole("button", { name: "Start plan" }).click();
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toBe("Candy over metallic ground");
    await expect.poll(() => page.getByRole("table", { name: "Material estimate" }).innerText()).toContain("Whole job");
    // The clear layer shows its safety cautions.
    await expect.poll(() => page.getByRole("note", { name: "Safety" }).count()).toBeGreaterThan(0);

    // Make a 300 mL batch of the clear (4:1:1): the preview is worked out as the amount is typed.
    await page.getByRole("button", { name: "Mix sheet for Clear" }).click();
    const dialog = page.getByRole("dialog");
    await dialog.getByRole("textbox", { name: "Batch size" }).fill("300");
    await expect.poll(() => dialog.getByRole("table", { name: "Batch preview" }).innerText()).toContain("200 mL");
    await dialog.getByRole("button", { name: "Make mix sheet" }).click();
    await page.waitForURL(/\/mix-sheets\/\d+$/);
    const sheet = page.getByRole("table", { name: "Components" });
    await expect.poll(() => sheet.innerText()).toMatch(/clear[\s\S]*200 mL[\s\S]*hardener[\s\S]*50 mL[\s\S]*reducer[\s\S]*50 mL/);
    await expect.poll(() => page.getByText("Not mixed yet").count()).toBeGreaterThan(0);

    // Record it as mixed with the suggested lots.
    await page.getByRole("button", { name: "Record as mixed" }).click();
    await expect.poll(() => page.getByText("Mixed", { exact: true }).count()).toBeGreaterThan(0);
    await expect.poll(() => page.getByText(/Pot life ends/).count()).toBe(1);
    await page.screenshot({ path: path.join(ARTEFACTS, "mix-sheet-mixed.png") });

    // 200 mL of clear came out of stock: 200 / 3785.411784 gal = 0.0528 gal (the page shows 3 decimals).
    const after = await clearStock(page, clear.id);
    expect(before - after).toBeCloseTo(200 / GALLON_ML, 2);
    expect(after).toBeLessThan(before);
    expect(errors).toEqual([]);
    await close();
  });

  it("the plan editor checks each layer's mix as it is typed, reorders layers with the buttons and by dragging, and saves", async () => {
    // Tall enough that both layer headers are on screen: Playwright scrolling in the middle of a drag cancels it.
    const { page, errors, close } = await newPage(browser, { width: 1280, height: 2400 });
    await signIn(page, baseUrl, "owner");
    await page.goto(`${baseUrl}/plans/new`);
    await page.getByRole("textbox", { name: "Plan name" }).fill(`Editor E2E ${Date.now()}`);

    // Layer 1: a clear, 4 parts clear + reducer 10 % of nothing yet → the engine's message beside "of".
    await page.getByLabel("New layer kind").selectOption("clear");
    await page.getByRole("button", { name: "Add layer" }).click();
    await page.getByRole("button", { name: "Add material" }).click();
    await page.getByRole("combobox", { name: "Material 1" }).selectOption({ label: "S5-B02 2K urethane clear, high gloss" });
    await expect.poll(() => page.getByRole("textbox", { name: "Name on the mix sheet" }).first().inputValue()).toBe("clear");
    await page.getByRole("textbox", { name: "Parts" }).first().fill("4");
    await page.getByRole("button", { name: "Add material" }).click();
    await page.getByRole("combobox", { name: "Material 2" }).selectOption({ label: "S6-B02 Urethane reducer, medium" });
    await page.getByText("Percent", { exact: true }).nth(1).click();
    await expect.poll(() => page.getByRole("radio", { name: "Percent" }).nth(1).isChecked()).toBe(true);
    await page.getByRole("textbox", { name: "Percent" }).fill("10");
    await expect.poll(() => page.getByText(/percentOf must name at least one component/).count()).toBe(1);
    await page.getByRole("checkbox", { name: "clear" }).check();
    await expect.poll(() => page.getByText(/Shares by volume: clear 90\.9 % · reducer 9\.1 %/).count()).toBe(1);

    // Layer 2: a sealer with no mix, then moved below the clear with the buttons.
    await page.getByLabel("New layer kind").selectOption("sealer");
    await page.getByRole("button", { name: "Add layer" }).click();
    await page.getByRole("button", { name: "Move layer 2 up" }).click();
    await expect.poll(() => page.getByRole("button", { name: /^Layer 1: / }).innerText()).toContain("Sealer");
    // Dragging the second layer's handle onto the first swaps them back; the down button undoes it again.
    await page.locator('[title="Drag to reorder"]').nth(1).dragTo(page.getByRole("button", { name: /^Layer 1: / }));
    await expect.poll(() => page.getByRole("button", { name: /^Layer 1: / }).innerText()).toContain("Clear");
    await page.getByRole("button", { name: "Move layer 1 down" }).click();
    await expect.poll(() => page.getByRole("button", { name: /^Layer 1: / }).innerText()).toContain("Sealer");

    await page.getByRole("button", { name: "Create template" }).click();
    await page.waitForURL(/\/plans\/\d+$/);
    const layers = page.getByRole("list", { name: "Layers, bottom to top" });
    await expect.poll(() => layers.innerText()).toMatch(/1\.\s*Sealer[\s\S]*2\.\s*Clear[\s\S]*\(clear\): 4 parts · 90\.9 % of the ready-to-spray mix/);
    // The reducer says what its percentage is of, by material, and its share of what goes in the gun: 10 / 110 = 9.1 %.
    expect(await layers.innerText()).toMatch(/\(reducer\): 10 % of S5-B02 2K urethane clear, high gloss · 9\.1 % of the ready-to-spray mix/);
    expect(errors).toEqual([]);
    await close();
  });

  it("the job page's plan button looks the same before and after the plan arrives (no colour flip under axe)", async () => {
    const { page, errors, close } = await newPage(browser);
    await signIn(page, baseUrl, "owner");
    const jobs = (await (await page.request.get(`${baseUrl}/api/jobs?pageSize=100`)).json()).items as { id: number; stage: string }[];
    let jobId: number | undefined;
    for (const j of jobs.filter((x) => x.stage === "in_booth" || x.stage === "in_prep")) {
      if ((await (await page.request.get(`${baseUrl}/api/jobs/${j.id}/plan`)).json()).plan) {
        jobId = j.id;
        break;
      }
    }
    expect(jobId, "a demo job with a finish plan").toBeDefined();

    // Hold the plan's answer back so the page is seen while that query is pending.
    let release!: () => void;
    const held = new Promise<void>((r) => (release = r));
    await page.route(`**/api/jobs/${jobId}/plan`, async (route) => {
      await held;
      await route.continue();
    });
    await page.goto(`${baseUrl}/jobs/${jobId}`);
    const panel = page.getByRole("region", { name: "Finish plan" });
    await panel.waitFor();
    const link = panel.locator('a[href$="/plan"]');
    const look = () => link.evaluateAll((els) => els.map((el) => `${el.textContent}|${getComputedStyle(el).backgroundColor}|${getComputedStyle(el).color}`));
    const whilePending = await look();
    release();
    await expect.poll(() => panel.getByText(/version \d+/).count()).toBe(1);
    await expect.poll(() => link.evaluate((el) => el.getAnimations().length)).toBe(0);
    const settled = await look();
    expect(settled).toHaveLength(1);
    expect(settled[0]).toMatch(/^Plan and mix sheets\|/);
    // While the plan loads there is no link at all (a placeholder holds its place), so nothing can change colour.
    expect(whilePending).toEqual([]);
    expect(errors).toEqual([]);
    await close();
  });

  it("a painter sees the catalogue without any price", async () => {
    const { page, errors, close } = await newPage(browser);
    await signIn(page, baseUrl, "painter");
    await page.goto(`${baseUrl}/materials`);
    const table = page.getByRole("table", { name: "Materials" });
    await expect.poll(() => table.innerText()).toContain("S5-B02");
    expect(await table.innerText()).not.toMatch(/\$/);
    expect(await table.getByRole("columnheader", { name: "Cost" }).count()).toBe(0);
    expect(errors).toEqual([]);
    await close();
  });
});

describe("mix calculator", () => {
  it("works the amounts out in the browser as the painter types, with grams, rounding and errors beside the field", async () => {
    const { page, errors, close } = await newPage(browser, { width: 1024, height: 1200 });
    await signIn(page, baseUrl, "painter");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Mix calculator" }).click();
    await page.waitForURL(/\/mix$/);
    // Starts at 4:1:1, 600 mL → 400 / 100 / 100 mL (references.md §7, 4:1:1 split).
    await expect.poll(() => page.getByTestId("amount-clear").innerText()).toBe("400 mL");
    let calls = 0;
    page.on("request", (r) => {
      if (r.url().includes("/api/mix/compute")) calls++;
    });
    // 12 fl oz of 2:1:1 → 6 / 3 / 3 fl oz (references.md §7, 2:1:1 split).
    await page.getByRole("textbox", { name: "Wanted total" }).fill("12");
    await page.getByLabel("Unit", { exact: true }).selectOption("floz");
    await page.getByRole("textbox", { name: "Parts" }).first().fill("2");
    await expect.poll(() => page.getByTestId("amount-clear").innerText()).toBe("6 fl oz");
    expect(await page.getByTestId("amount-hardener").innerText()).toBe("3 fl oz");

    // Back to 4:1:1, 300 mL with densities 1.00 / 1.10 / 0.87 g/mL → scale reads 200.0, 255.0, 298.5 g (references.md §7).
    await page.getByRole("textbox", { name: "Parts" }).first().fill("4");
    await page.getByRole("textbox", { name: "Wanted total" }).fill("300");
    await page.getByLabel("Unit", { exact: true }).selectOption("mL");
    const densities = page.getByRole("textbox", { name: "Density g/mL" });
    await densities.nth(0).fill("1.00");
    await densities.nth(1).fill("1.10");
    await densities.nth(2).fill("0.87");
    const amounts = page.getByRole("table", { name: "Amounts to measure" });
    await expect.poll(() => amounts.innerText()).toMatch(/298\.5 g/);
    expect(await amounts.innerText()).toMatch(/255 g/);

    // Rounding to a 25 mL cup mark lands every part on a mark (200 / 50 / 50 mL), so every ratio is exact.
    await page.getByRole("textbox", { name: "Round to a step of" }).fill("25");
    await expect.poll(() => page.getByText(/Rounded to 25 mL: every ratio is exact\./).count()).toBe(1);

    // A zero part is an error shown beside that field, and the amounts wait for a fix.
    await page.getByRole("textbox", { name: "Parts" }).nth(1).fill("0");
    await expect.poll(() => page.getByText(/must be a finite number greater than 0/).count()).toBe(1);
    expect(await page.getByText("Fix the highlighted field to see the amounts.").count()).toBe(1);
    expect(calls).toBe(0);
    expect(errors).toEqual([]);
    await close();
  });
});
