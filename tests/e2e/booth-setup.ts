import { expect } from "vitest";
import type { Browser, Page } from "playwright-core";
import { newPage, signIn } from "./browser";

/** JSON call from inside the signed-in page (same origin, the session cookie goes along). */
export async function call<T>(page: Page, method: string, url: string, body?: unknown): Promise<T> {
  const res = await page.evaluate(
    async ([m, u, b]) => {
      const r = await fetch(u as string, { method: m as string, headers: { "Content-Type": "application/json" }, body: b === undefined ? undefined : JSON.stringify(b) });
      return { status: r.status, json: await r.json().catch(() => null) };
    },
    [method, url, body] as const,
  );
  if (res.status >= 400) throw new Error(`${method} ${url} → ${res.status} ${JSON.stringify(res.json)}`);
  return res.json as T;
}

/**
 * The office sets up a fresh job for the demo painter: one steel item, the "Candy over metallic ground" template
 * (sealer 1 coat, metallic ground 3 coats with an 8-minute flash…), moved to prep, prep signed off.
 */
export async function jobReadyForTheBooth(browser: Browser, baseUrl: string): Promise<number> {
  const { page, close } = await newPage(browser);
  await signIn(page, baseUrl, "owner");
  const templates = await call<{ id: number; name: string }[]>(page, "GET", "/api/plans?kind=template");
  const template = templates.find((t) => t.name === "Candy over metallic ground")!;
  expect(template).toBeTruthy();
  const customers = await call<{ items: { id: number }[] }>(page, "GET", "/api/customers?pageSize=1");
  const painters = await call<{ id: string; name: string }[]>(page, "GET", "/api/painters");
  const marco = painters.find((p) => p.name === "Marco Vell")!;
  const job = await call<{ id: number }>(page, "POST", "/api/jobs", { customerId: customers.items[0]!.id, title: `E2E booth tank ${Date.now()}`, assignedPainterId: marco.id });
  const item = await call<{ id: number }>(page, "POST", `/api/jobs/${job.id}/items`, { name: "Fuel tank", substrate: "steel", surfaceArea: 0.6, areaUnit: "m2" });
  await call(page, "POST", `/api/jobs/${job.id}/plan`, { fromPlanId: template.id });
  await call(page, "POST", `/api/jobs/${job.id}/stage`, { stage: "booked" });
  await call(page, "POST", `/api/jobs/${job.id}/stage`, { stage: "in_prep" });
  const prep = await call<{ id: number }>(page, "POST", "/api/prep-records", { itemId: item.id, scuffMedium: "scuff_pad", scuffGrit: 600, cleaner: "Wax and grease remover", tackCloth: true });
  await call(page, "POST", `/api/prep-records/${prep.id}/sign-off`);
  // The sealer is catalysed (2K): its batch is recorded as mixed before the first coat, as at the bench.
  const card = await call<{ layers: { id: number; kind: string }[] }>(page, "GET", `/api/jobs/${job.id}/booth`);
  const sealer = card.layers.find((l) => l.kind === "sealer")!;
  const sheet = await call<{ id: number }>(page, "POST", "/api/mix-sheets", { jobId: job.id, layerId: sealer.id, mode: "total", amount: 250, unit: "mL" });
  await call(page, "POST", `/api/mix-sheets/${sheet.id}/record`, { lines: [] });
  await close();
  return job.id;
}
