import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import path from "node:path";
import { ARTEFACTS, launch, newPage, signIn } from "./browser";

/*
 * A change after approval in a browser, against the real product with its SMTP and payments stand-ins: the customer
 * approved the quote; the shop saves plan version 2 (a new candy); the booth card stays on version 1 and marks the
 * candy "Change waiting for the customer"; the office prices the change and sends it; the customer opens the e-mail's
 * link, approves, and pays the extra deposit on the stand-in's checkout page (its signed webhook records it); the
 * booth card then works from version 2.
 */
const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function api<T>(page: Page, url: string, init?: { method?: string; data?: unknown; headers?: Record<string, string> }): Promise<T> {
  const res = await page.request.fetch(`${baseUrl}${url}`, { method: init?.method ?? "GET", data: init?.data, headers: init?.headers });
  if (!res.ok()) throw new Error(`${init?.method ?? "GET"} ${url}: ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

type Outbox = { items: { subject: string; text: string }[] };
const linkIn = async (owner: Page, subject: string) => {
  const mail = (await api<Outbox>(owner, "/api/outbox")).items.find((m) => m.subject === subject);
  expect(mail).toBeDefined();
  return /https?:\/\/\S+\/portal\/link\/\S+/.exec(mail!.text)![0];
};

type PlanDoc = { id: number; name: string; description: string | null; version: number; latest: { version: number; layers: Record<string, unknown>[] } };

/** The plan's latest version sent back as the editor sends it (the API drops the read-only keys), one layer renamed. */
function withLayerRenamed(plan: PlanDoc, kind: string, name: string) {
  const layers = plan.latest.layers.map((l) => (l.kind === kind ? { ...l, name } : l));
  return { name: plan.name, description: plan.description, versionNote: "Customer asked for a deeper candy", layers, version: plan.version };
}

async function fillCard(page: Page, card: string) {
  await page.getByLabel("Card number").fill(card);
  await page.getByLabel("Expiry (MM / YY)").fill("12 / 34");
  await page.getByLabel("Security code").fill("123");
  await page.getByRole("button", { name: /^Pay \$/ }).click();
}

describe("change orders", () => {
  it("approved job → plan version 2 → the booth waits → the customer approves and pays the difference → the booth works from version 2", async () => {
    const owner = await newPage(browser);
    await signIn(owner.page, baseUrl, "owner");
    const o = owner.page;
    // A fresh job for a demo customer, approved by them, so the spec does not depend on other specs' changes.
    const customers = await api<{ items: { id: number; name: string }[] }>(o, "/api/customers?q=Tobias%20Wren");
    const customerId = customers.items.find((c) => c.name === "Tobias Wren")!.id;
    const title = `Tank change E2E ${Date.now()}`;
    const job = await api<{ id: number }>(o, "/api/jobs", { method: "POST", data: { customerId, title } });
    await api(o, `/api/jobs/${job.id}/items`, { method: "POST", data: { name: "Fuel tank", substrate: "steel", surfaceArea: 0.6, areaUnit: "m2" } });
    const templates = await api<{ id: number; layerKinds: string[] }[]>(o, "/api/plans?kind=template");
    const template = templates.find((t) => t.layerKinds.includes("candy"))!;
    const plan = await api<PlanDoc>(o, `/api/jobs/${job.id}/plan`, { method: "POST", data: { fromPlanId: template.id } });
    const quote = await api<{ id: number; editVersion: number }>(o, "/api/quotes", { method: "POST", data: { jobId: job.id } });
    await api(o, `/api/quotes/${quote.id}`, { method: "PATCH", data: { lines: [{ kind: "labour", description: "Prep and paint", hours: 10, rateCents: 9500 }], editVersion: quote.editVersion } });
    await api(o, `/api/quotes/${quote.id}/send`, { method: "POST", data: {} });
    const quoteMail = (await api<Outbox>(o, "/api/outbox")).items.find((m) => m.subject.startsWith("Your quote from") && m.subject.endsWith(title))!;
    const quoteLink = /https?:\/\/\S+\/portal\/link\/\S+/.exec(quoteMail.text)![0];
    const token = decodeURIComponent(new URL(quoteLink).pathname.split("/").pop()!);
    await api(o, `/api/portal/quotes/${quote.id}/approve`, { method: "POST", data: { name: "Tobias Wren" }, headers: { "x-portal-token": token } });

    // The shop changes the plan: version 2, a draft change order; the booth stays on version 1 and waits.
    const saved = await api<PlanDoc>(o, `/api/plans/${plan.id}`, { method: "PUT", data: withLayerRenamed(plan, "candy", "Candy midnight blue") });
    expect(saved.latest.version).toBe(2);
    await o.goto(`${baseUrl}/booth/${job.id}`);
    const layers = o.getByRole("region", { name: "Layers" });
    await expect.poll(() => layers.innerText()).toContain("version 1");
    expect(await layers.getByText("Change waiting for the customer").count()).toBe(1);
    await o.getByText(/has not been approved by the customer\. The marked layers wait/).waitFor();
    await o.screenshot({ path: path.join(ARTEFACTS, "booth-change-waiting.png"), fullPage: true });

    // The office prices the change on the job page and sends it.
    await o.goto(`${baseUrl}/jobs/${job.id}`);
    const panel = o.getByRole("region", { name: "Change orders" });
    await panel.getByText("Being prepared").waitFor();
    expect(await panel.getByText("Candy midnight blue").count()).toBeGreaterThan(0);
    await panel.getByLabel("Labour line", { exact: true }).fill("Second candy mix and extra coat");
    await panel.getByLabel("Hours", { exact: true }).fill("2");
    await panel.getByLabel("Rate", { exact: true }).fill("95");
    await panel.getByRole("button", { name: "Add line" }).click();
    await o.screenshot({ path: path.join(ARTEFACTS, "change-order-line.png"), fullPage: true });
    // 2 h × $95 = $190.00; labour is untaxed at the demo settings; 40 % extra deposit = $76.00 (by hand).
    await panel.getByText("$190.00").first().waitFor();
    await panel.getByRole("button", { name: "Send to the customer" }).click();
    await panel.getByText("Waiting for the customer").waitFor();
    expect(owner.errors).toEqual([]);

    // The customer opens the e-mail's link on a phone, approves and pays the extra deposit.
    const link = await linkIn(o, `A change to your job needs your answer: ${title}`);
    const customer = await newPage(browser, { width: 390, height: 844 });
    const c = customer.page;
    await c.goto(link);
    const change = c.getByRole("region", { name: `A change to ${title}` });
    await change.getByText("Candy midnight blue").first().waitFor();
    await change.getByLabel("Your name (as your signature)").fill("Tobias Wren");
    await change.getByRole("button", { name: "Approve the change" }).click();
    await change.getByRole("button", { name: "Pay extra deposit $76.00" }).click();
    await c.waitForURL(/\/pay\/cs_test_/);
    await fillCard(c, "4242 4242 4242 4242");
    await c.waitForURL(/\/portal\/link\/.+change=\d+.*paid=1/);
    await c.getByText("Extra deposit paid").waitFor({ timeout: 20_000 });
    await c.screenshot({ path: path.join(ARTEFACTS, "portal-change-paid.png"), fullPage: true });
    expect(customer.errors).toEqual([]);
    const paid = await api<{ items: { amountCents: number; flagged: boolean }[] }>(o, `/api/payments?jobId=${job.id}`);
    expect(paid.items).toEqual([expect.objectContaining({ amountCents: 7600, flagged: false })]);

    // The booth card now works from version 2, with nothing waiting.
    await o.goto(`${baseUrl}/booth/${job.id}`);
    await expect.poll(() => o.getByRole("region", { name: "Layers" }).innerText()).toContain("version 2");
    expect(await o.getByRole("region", { name: "Layers" }).getByText("Candy midnight blue").count()).toBe(1);
    expect(await o.getByText("Change waiting for the customer").count()).toBe(0);
    await o.screenshot({ path: path.join(ARTEFACTS, "booth-version-2.png"), fullPage: true });
    await Promise.all([owner.close(), customer.close()]);
  });
});
