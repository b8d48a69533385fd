import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import path from "node:path";
import { ARTEFACTS, launch, newPage, signIn } from "./browser";
import type { FinishRecordDto } from "../../shared/schemas/finish-record.schema";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function api<T>(page: Page, method: "GET" | "POST" | "PUT", url: string, data?: unknown): Promise<T> {
  const res = await page.request.fetch(`${baseUrl}${url}`, { method, data });
  expect(res.status(), `${method} ${url}: ${await res.text()}`).toBeLessThan(300);
  return (await res.json()) as T;
}

describe("the spray record", () => {
  it("the owner reads a delivered job's finish record and repeats the finish as a new job with the coats as sprayed", async () => {
    const { page, errors, close } = await newPage(browser, { width: 1280, height: 1000 });
    await signIn(page, baseUrl, "owner");
    const delivered = (await api<{ items: { id: number; title: string; customerName: string }[] }>(page, "GET", "/api/jobs?stage=delivered&pageSize=50")).items;
    expect(delivered.length).toBeGreaterThan(0);
    const source = delivered[0]!;
    const record = await api<FinishRecordDto>(page, "GET", `/api/jobs/${source.id}/finish-record`);

    // The job page leads to the record; the record lists every layer with its coats and the gun set-up.
    await page.goto(`${baseUrl}/jobs/${source.id}`);
    await page.getByRole("link", { name: "Open the finish record" }).click();
    await page.waitForURL(new RegExp(`/jobs/${source.id}/finish-record$`));
    // The job page has the same heading: wait for the record itself (the next screen loads behind the current one).
    await page.getByText(`Finish record · job #${source.id}`).waitFor();
    const sprayed = record.layers.filter((l) => l.coats.length > 0);
    expect(sprayed.length).toBeGreaterThan(0);
    for (const layer of sprayed) {
      const table = page.getByRole("table", { name: `Coats of ${layer.name}` });
      await expect.poll(() => table.getByRole("row").count()).toBe(layer.coats.length + 1);
      expect(await table.innerText()).toContain(layer.coats[0]!.setup.summary);
    }
    await page.screenshot({ path: path.join(ARTEFACTS, "finish-record.png"), fullPage: true });
    const pdf = await page.request.get(`${baseUrl}/api/jobs/${source.id}/finish-record.pdf`);
    expect(pdf.headers()["content-type"]).toBe("application/pdf");

    // Repeat it: a new job for the same customer, the plan copied as it was sprayed.
    await page.goto(`${baseUrl}/jobs/${source.id}`);
    await page.getByRole("button", { name: "Repeat this finish…" }).click();
    const dialog = page.getByRole("dialog", { name: "Repeat this finish" });
    // The customer picker starts on the job's own customer (searchable, like the job form's).
    await expect.poll(() => dialog.getByRole("combobox", { name: "Customer" }).inputValue()).toBe(source.customerName);
    await dialog.getByLabel("Title of the new job").fill(`Repeat of #${source.id} in the browser`);
    await dialog.getByRole("button", { name: "Start the new job" }).click();
    // Either straight to the new job, or first the list of lots that are used up.
    const usedUp = page.getByRole("button", { name: "Open the new job" });
    await expect.poll(async () => (await usedUp.isVisible()) || /\/jobs\/\d+$/.test(new URL(page.url()).pathname) && !page.url().endsWith(`/jobs/${source.id}`)).toBe(true);
    if (await usedUp.isVisible()) await usedUp.click();
    await page.getByRole("heading", { level: 1, name: `Repeat of #${source.id} in the browser` }).waitFor();
    const newId = Number(new URL(page.url()).pathname.split("/").pop());
    expect(newId).not.toBe(source.id);
    const copy = (await api<{ plan: { latest: { layers: { name: string; coats: number }[] } } }>(page, "GET", `/api/jobs/${newId}/plan`)).plan;
    for (const layer of sprayed) expect(copy.latest.layers.find((l) => l.name === layer.name)?.coats).toBe(layer.coats.length);
    expect(errors).toEqual([]);
    await close();
  });

  it("the booth card shows the approved panel's set-up as the target and starts the coat from it", async () => {
    const { page, errors, close } = await newPage(browser, { width: 820, height: 1180 });
    await signIn(page, baseUrl, "owner");
    const templates = await api<{ id: number; name: string }[]>(page, "GET", "/api/plans?kind=template");
    const customers = await api<{ items: { id: number }[] }>(page, "GET", "/api/customers?pageSize=1");
    const job = await api<{ id: number }>(page, "POST", "/api/jobs", { customerId: customers.items[0]!.id, title: `E2E set-up ${Date.now()}` });
    const item = await api<{ id: number }>(page, "POST", `/api/jobs/${job.id}/items`, { name: "Helmet", substrate: "steel", surfaceArea: 0.3, areaUnit: "m2" });
    await api(page, "POST", `/api/jobs/${job.id}/plan`, { fromPlanId: templates.find((t) => t.name === "Candy over metallic ground")!.id });
    const plan = await api<{ plan: { latest: { layers: { id: number; kind: string }[] } } }>(page, "GET", `/api/jobs/${job.id}/plan`);
    const first = plan.plan.latest.layers.find((l) => l.kind !== "prep")!;
    const guns = await api<{ id: number; name: string }[]>(page, "GET", "/api/guns");
    const panel = await api<{ id: number }>(page, "POST", "/api/panels", {
      groundName: "Fine silver",
      candyName: "Apple red",
      letDownClear: 6,
      letDownToner: 1,
      coats: 4,
      jobId: job.id,
      planLayerId: first.id,
      gunId: guns[0]!.id,
      tipMm: 1.4,
      inletPressure: 27,
      pressureUnit: "psi",
      distance: 7,
      distanceUnit: "in",
      overlapPct: 60,
    });
    await api(page, "PUT", `/api/jobs/${job.id}/approved-panel`, { panelId: panel.id });
    for (const stage of ["booked", "in_prep"]) await api(page, "POST", `/api/jobs/${job.id}/stage`, { stage });
    const prep = await api<{ id: number }>(page, "POST", "/api/prep-records", { itemId: item.id, scuffMedium: "scuff_pad", scuffGrit: 600, cleaner: "Wax and grease remover", tackCloth: true });
    await api(page, "POST", `/api/prep-records/${prep.id}/sign-off`);

    await page.goto(`${baseUrl}/booth/${job.id}`);
    const target = page.getByTestId("setup-target");
    await target.waitFor();
    expect(await target.innerText()).toContain(`${guns[0]!.name} · 1.4 mm tip · 27 psi at the inlet · 7 in from the part · 60 % overlap`);
    expect(await page.getByTestId("setup-current").innerText()).toContain("1.4 mm tip");
    // The painter changes what was really used; the line for this coat follows.
    await page.getByRole("button", { name: "Change the set-up for this coat…" }).click();
    await page.getByLabel("Tip (mm)").fill("1.3");
    await expect.poll(() => page.getByTestId("setup-current").innerText()).toContain("1.3 mm tip");
    expect(await page.getByTestId("setup-target").innerText()).toContain("1.4 mm tip");
    const box = await page.getByLabel("Gun").boundingBox();
    expect(box!.height).toBeGreaterThanOrEqual(48);
    await page.screenshot({ path: path.join(ARTEFACTS, "booth-setup.png"), fullPage: false });
    expect(errors).toEqual([]);
    await close();
  });
});
