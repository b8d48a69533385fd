import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import path from "node:path";
import { ARTEFACTS, launch, newPage, signIn } from "./browser";

/*
 * The whole quote-to-deposit path in a browser, against the real product (`npm start` with the SMTP and
 * payments stand-ins): an estimator prices and sends a quote, the customer opens the link from the e-mail on a
 * phone, approves, is declined with the test card 4000 0000 0000 0002 (nothing recorded), then pays with
 * 4242 4242 4242 4242 on the stand-in's checkout page, and the job shows booked with the payment.
 */
const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function api<T>(page: Page, url: string, init?: { method?: string; data?: unknown }): Promise<T> {
  const send = () => page.request.fetch(`${baseUrl}${url}`, { method: init?.method ?? "GET", data: init?.data });
  // A kept-alive socket the server has just closed can reset once under load; a GET is safe to repeat.
  const res = await send().catch((e: Error) => {
    if ((init?.method ?? "GET") === "GET" && /ECONNRESET/.test(e.message)) return send();
    throw e;
  });
  if (!res.ok()) throw new Error(`${init?.method ?? "GET"} ${url}: ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

async function fillCard(page: Page, card: string) {
  await page.getByLabel("Card number").fill(card);
  await page.getByLabel("Expiry (MM / YY)").fill("12 / 34");
  await page.getByLabel("Security code").fill("123");
  await page.getByRole("button", { name: /^Pay \$/ }).click();
}

describe("quote, approval and deposit", () => {
  it("estimator sends a quote; the customer approves from the e-mail link and pays; the job is booked with the payment", async () => {
    const office = await newPage(browser);
    await signIn(office.page, baseUrl, "estimator");
    // A fresh inquiry for the demo customer, so the spec does not depend on other specs' changes.
    const customers = await api<{ items: { id: number; name: string }[] }>(office.page, "/api/customers?q=Tobias%20Wren");
    const customerId = customers.items.find((c) => c.name === "Tobias Wren")!.id;
    const title = `Tank and fenders E2E ${Date.now()}`;
    const job = await api<{ id: number }>(office.page, "/api/jobs", { method: "POST", data: { customerId, title } });
    await api(office.page, `/api/jobs/${job.id}/items`, { method: "POST", data: { name: "Fuel tank", substrate: "steel", surfaceArea: 0.6, areaUnit: "m2" } });

    // The estimator starts the quote from the job and prices it.
    await office.page.goto(`${baseUrl}/jobs/${job.id}`);
    await office.page.getByRole("button", { name: "New quote" }).click();
    await office.page.waitForURL(/\/quotes\/\d+$/);
    const quoteId = Number(new URL(office.page.url()).pathname.split("/").pop());
    await office.page.getByLabel("Line 1 Hours").fill("6");
    await office.page.getByLabel("Line 2 Hours").fill("4");
    await office.page.getByLabel("Line 3 Hours").fill("2");
    await office.page.getByRole("button", { name: "Add materials" }).click();
    await office.page.getByLabel("Line 4 Description").fill("Candy red, silver ground, sealer and 2K clear");
    await office.page.getByLabel("Line 4 Shop cost").fill("200");
    // Demo settings: $95/h, 30 % markup, 8 % supplies, 7.25 % tax on materials and supplies, 40 % deposit.
    // 12 h × $95 = $1,140.00; $200 + 30 % = $260.00; 8 % of labour = $91.20; tax 7.25 % × $351.20 = $25.462 → $25.46;
    // total $1,516.66; deposit 40 % = $606.664 → $606.66 [C].
    await expect.poll(() => office.page.getByTestId("quote-total").innerText()).toBe("$1,516.66");
    await office.page.getByRole("button", { name: "Save draft" }).click();
    await office.page.getByRole("button", { name: "Saved" }).waitFor();
    await office.page.getByRole("button", { name: "Send to customer…" }).click();
    await office.page.getByRole("dialog").getByRole("button", { name: "Send quote" }).click();
    await office.page.getByRole("dialog").waitFor({ state: "detached" });
    await office.page.getByText("Waiting for an answer").waitFor();
    expect(office.errors).toEqual([]);

    // The e-mail arrived at the SMTP stand-in with the PDF; the owner reads the link from the outbox.
    const owner = await newPage(browser);
    await signIn(owner.page, baseUrl, "owner");
    const outbox = await api<{ items: { subject: string; text: string; attachments: { filename: string; contentType: string }[] }[] }>(owner.page, "/api/outbox");
    const mail = outbox.items.find((m) => m.subject.includes(title));
    expect(mail).toBeDefined();
    expect(mail!.attachments).toEqual([expect.objectContaining({ filename: `quote-${quoteId}-v1.pdf`, contentType: "application/pdf" })]);
    const link = /https?:\/\/\S+\/portal\/link\/\S+/.exec(mail!.text)![0];

    // The customer opens it on a phone, without signing in, and approves.
    const customer = await newPage(browser, { width: 390, height: 844 });
    await customer.page.goto(link);
    await customer.page.getByRole("heading", { name: title, level: 1 }).waitFor();
    expect(await customer.page.getByText("$1,516.66").count()).toBeGreaterThan(0);
    await customer.page.getByRole("button", { name: "Approve quote" }).click();
    await customer.page.getByRole("button", { name: "Pay deposit $606.66" }).click();

    // The stand-in's checkout page: the declined test card first.
    await customer.page.waitForURL(/\/pay\/cs_test_/);
    await fillCard(customer.page, "4000 0000 0000 0002");
    await customer.page.getByText("Your card was declined").waitFor();
    const afterDecline = await api<{ items: unknown[] }>(owner.page, `/api/payments?jobId=${job.id}`);
    expect(afterDecline.items).toEqual([]);
    expect((await api<{ stage: string }>(owner.page, `/api/jobs/${job.id}`)).stage).toBe("quoted");

    // Then the card that pays; back in the portal the payment is confirmed once the webhook arrives.
    await fillCard(customer.page, "4242 4242 4242 4242");
    await customer.page.waitForURL(/\/portal\/link\/.+paid=1/);
    await customer.page.getByText(/Deposit received: \$606\.66/).waitFor({ timeout: 20_000 });
    await customer.page.screenshot({ path: path.join(ARTEFACTS, "portal-deposit-paid.png"), fullPage: true });
    expect(customer.errors).toEqual([]);

    // The office sees the job booked and the payment on the quote.
    await office.page.goto(`${baseUrl}/jobs/${job.id}`);
    await expect.poll(() => office.page.getByRole("region", { name: "Stage", exact: true }).innerText()).toContain("Booked");
    await office.page.getByText("Deposit of $606.66 paid online").waitFor();
    await office.page.goto(`${baseUrl}/quotes/${quoteId}`);
    const payments = office.page.getByRole("region", { name: "Payments", exact: true });
    await expect.poll(() => payments.innerText()).toContain("$606.66");
    expect(await payments.innerText()).toContain("Paid");
    await office.page.screenshot({ path: path.join(ARTEFACTS, "quote-paid.png"), fullPage: true });
    const paid = await api<{ items: { amountCents: number; flagged: boolean }[] }>(owner.page, `/api/payments?jobId=${job.id}`);
    expect(paid.items).toEqual([expect.objectContaining({ amountCents: 60666, flagged: false })]);
    // The receipt went out too.
    await expect
      .poll(async () => (await api<{ items: { subject: string }[] }>(owner.page, "/api/outbox")).items.some((m) => m.subject === `Deposit received: ${title}`), { timeout: 10_000 })
      .toBe(true);
    await Promise.all([office.close(), owner.close(), customer.close()]);
  });

  it("the quote editor warns before unsaved edits are lost: leaving the tab, or moving to another screen", async () => {
    const { page, errors, close } = await newPage(browser);
    await signIn(page, baseUrl, "estimator");
    const customers = await api<{ items: { id: number; name: string }[] }>(page, "/api/customers?q=Tobias%20Wren");
    const customerId = customers.items.find((c) => c.name === "Tobias Wren")!.id;
    const job = await api<{ id: number }>(page, "/api/jobs", { method: "POST", data: { customerId, title: `Leave guard E2E ${Date.now()}` } });
    const quote = await api<{ id: number }>(page, "/api/quotes", { method: "POST", data: { jobId: job.id } });
    await page.goto(`${baseUrl}/quotes/${quote.id}`);
    const nav = page.getByRole("navigation", { name: "Main" });

    // Nothing typed yet: moving away does not ask.
    await page.getByLabel("Line 1 Hours").waitFor();
    await nav.getByRole("link", { name: "Jobs" }).click();
    await page.waitForURL((u) => u.pathname === "/jobs");
    await page.goBack();
    await page.getByLabel("Line 1 Hours").fill("3");
    await page.getByRole("button", { name: "Save draft" }).waitFor();

    // Closing or reloading the tab: the browser's own question.
    const asked = new Promise<string>((resolve) => page.once("dialog", (d) => (resolve(d.type()), void d.dismiss())));
    await page.close({ runBeforeUnload: true });
    expect(await asked).toBe("beforeunload");
    expect(page.isClosed()).toBe(false);

    // Another screen inside the app: our own question. "Stay" keeps the edit on screen.
    await nav.getByRole("link", { name: "Jobs" }).click();
    const dialog = page.getByRole("dialog", { name: "Leave without saving?" });
    await dialog.waitFor();
    expect(new URL(page.url()).pathname).toBe(`/quotes/${quote.id}`);
    await dialog.getByRole("button", { name: "Stay on this page" }).click();
    await dialog.waitFor({ state: "detached" });
    expect(await page.getByLabel("Line 1 Hours").inputValue()).toBe("3");

    // "Save and leave" saves the draft, then goes.
    await nav.getByRole("link", { name: "Jobs" }).click();
    await dialog.getByRole("button", { name: "Save and leave" }).click();
    await page.waitForURL((u) => u.pathname === "/jobs");
    const saved = await api<{ current: { lines: { hours?: number }[] } }>(page, `/api/quotes/${quote.id}`);
    expect(saved.current.lines[0]!.hours).toBe(3);
    expect(errors).toEqual([]);
    await close();
  });

  it("a painter has no quotes in the navigation and is refused the quote screens", async () => {
    const { page, close } = await newPage(browser);
    await signIn(page, baseUrl, "painter");
    const nav = page.getByRole("navigation", { name: "Main" });
    await nav.waitFor();
    expect(await nav.getByRole("link", { name: "Quotes" }).count()).toBe(0);
    const res = await page.request.get(`${baseUrl}/api/quotes`);
    expect(res.status()).toBe(403);
    await page.goto(`${baseUrl}/quotes`);
    await page.getByRole("heading", { name: "Not available" }).waitFor();
    await close();
  });
});
