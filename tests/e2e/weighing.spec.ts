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

async function call<T>(page: Page, method: string, url: string, data?: unknown): Promise<T> {
  const res = await page.request.fetch(`${baseUrl}${url}`, { method, data });
  if (res.status() >= 400) throw new Error(`${method} ${url} → ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

describe("weighing a batch at the bench", () => {
  it("a painter weighs a clear one component at a time: tare, pour to the target, next; the readings add up to the stated batch", async () => {
    const { page, errors, close } = await newPage(browser, { width: 1280, height: 1400 });
    await signIn(page, baseUrl, "owner");
    const templates = await call<{ id: number; name: string }[]>(page, "GET", "/api/plans?kind=template");
    const template = templates.find((t) => t.name === "Candy over metallic ground")!;
    const customers = await call<{ items: { id: number }[] }>(page, "GET", "/api/customers?pageSize=1");
    const job = await call<{ id: number }>(page, "POST", "/api/jobs", { customerId: customers.items[0]!.id, title: `E2E weighing ${Date.now()}` });
    await call(page, "POST", `/api/jobs/${job.id}/items`, { name: "Side cover", substrate: "steel", surfaceArea: 0.2, areaUnit: "m2" });
    const plan = await call<{ latest: { layers: { id: number; kind: string; components: { densityGPerMl: number | null }[] }[] } }>(page, "POST", `/api/jobs/${job.id}/plan`, {
      fromPlanId: template.id,
    });
    const clear = plan.latest.layers.find((l) => l.kind === "clear" && l.components.every((c) => c.densityGPerMl != null))!;
    expect(clear).toBeTruthy();
    const sheet = await call<{ id: number; scaleLastReading: number; lines: { label: string; scaleTarget: number; scaleReads: number }[] }>(page, "POST", "/api/mix-sheets", {
      jobId: job.id,
      layerId: clear.id,
      mode: "total",
      amount: 350,
      unit: "mL",
      weigh: true,
      roundingStep: 0.1,
      roundingUnit: "g",
    });
    // The figures add up: the last scale reading is the sum of the targets shown and the stated batch.
    const sum = sheet.lines.reduce((a, l) => a + Math.round(l.scaleTarget * 10), 0) / 10;
    expect(sheet.lines.at(-1)!.scaleReads).toBe(sum);
    expect(sheet.scaleLastReading).toBe(sum);

    await page.goto(`${baseUrl}/mix-sheets/${sheet.id}`);
    const weigh = page.getByRole("region", { name: "Weigh it, one component at a time" });
    await weigh.waitFor();
    const first = sheet.lines[0]!;
    await expect.poll(() => weigh.locator('[aria-current="step"]').innerText()).toContain(`Tare, then pour ${first.label}`);
    await expect.poll(() => page.getByTestId(`weigh-target-${first.label}`).innerText()).toBe(`${first.scaleTarget.toFixed(1)} g`);
    // Each line says what its amount is and its share of the ready-to-spray mix.
    await expect.poll(() => page.getByRole("table", { name: "Components" }).innerText()).toMatch(/% of the ready-to-spray mix/);
    await page.screenshot({ path: path.join(ARTEFACTS, "weighing-step-1.png"), fullPage: true });

    for (const l of sheet.lines) await weigh.getByRole("button", { name: `Poured ${l.label}: next` }).click();
    await expect.poll(() => weigh.getByRole("status").innerText()).toBe(`All ${sheet.lines.length} poured: ${sum.toFixed(1)} g in the cup. Stir before use.`);
    await weigh.getByRole("button", { name: "Back" }).click();
    await expect.poll(() => weigh.locator('[aria-current="step"]').innerText()).toContain(`Tare, then pour ${sheet.lines.at(-1)!.label}`);
    expect(errors).toEqual([]);
    await close();
  });
});
