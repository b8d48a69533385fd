import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import path from "node:path";
import sharp from "sharp";
import { ARTEFACTS, launch, newPage, seriousViolations, signIn, waitForQuiet } from "./browser";

/*
 * Intake and the colour sign-off in a browser, against the real product: the estimator inspects a new job's item and
 * starts the quote with the suggested prep line; the shop sends two test panels to the customer; the customer picks
 * one in the portal; the job then shows it as the approved colour, approved by the customer.
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
  const res = await page.request.fetch(`${baseUrl}${url}`, { method: init?.method ?? "GET", data: init?.data });
  if (!res.ok()) throw new Error(`${init?.method ?? "GET"} ${url}: ${res.status()} ${await res.text()}`);
  return (await res.json()) as T;
}

/** A sprayed-looking swatch photo of a panel, through the same checked upload as the screens use. */
async function panelWithPhoto(page: Page, jobId: number, coats: number, lab: { labL: number; labA: number; labB: number }, rgb: { r: number; g: number; b: number }) {
  const panel = await api<{ id: number; label: string }>(page, "/api/panels", {
    method: "POST",
    data: { groundName: "Fine silver", candyName: "Candy garnet", letDownClear: 6, letDownToner: 1, coats, jobId, ...lab },
  });
  const png = await sharp({ create: { width: 96, height: 96, channels: 3, background: rgb } }).png().toBuffer();
  const res = await page.request.post(`${baseUrl}/api/uploads`, {
    multipart: { ownerType: "panel", ownerId: String(panel.id), light: "daylight", file: { name: `panel-${panel.id}.png`, mimeType: "image/png", buffer: png } },
  });
  expect(res.status()).toBe(201);
  return panel;
}

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(ARTEFACTS, name), fullPage: true });

describe("intake inspection and the customer's colour sign-off", () => {
  it("estimator inspects and adds the prep line; the shop sends panels; the customer approves one; the job shows it", async () => {
    const office = await newPage(browser);
    await signIn(office.page, baseUrl, "estimator");
    const customers = await api<{ items: { id: number; name: string }[] }>(office.page, "/api/customers?q=Tobias%20Wren");
    const customerId = customers.items.find((c) => c.name === "Tobias Wren")!.id;
    const title = `Tank intake E2E ${Date.now()}`;
    const job = await api<{ id: number }>(office.page, "/api/jobs", { method: "POST", data: { customerId, title } });
    await api(office.page, `/api/jobs/${job.id}/items`, { method: "POST", data: { name: "Fuel tank", substrate: "steel", surfaceArea: 0.6, areaUnit: "m2" } });

    // The estimator inspects the tank from the job page.
    await office.page.goto(`${baseUrl}/jobs/${job.id}`);
    await office.page.getByRole("link", { name: "Intake inspection" }).click();
    await office.page.getByRole("heading", { name: "Fuel tank" }).waitFor();
    const form = office.page.getByRole("form", { name: "Intake inspection" });
    await form.getByLabel("Existing finish").selectOption("factory_finish");
    await form.getByLabel("Solvent test").selectOption("softens");
    await form.getByLabel("Rust").selectOption("minor");
    await form.getByLabel("Hardware to remove").fill("Tank badges");
    await form.getByLabel("Note (shop only)").fill("Dent under the left knee pad: check after stripping");
    await form.getByLabel("Summary for the customer").fill("Surface rust by the filler neck; the badges come off and go back on.");
    await form.getByRole("button", { name: "Save inspection" }).click();
    // Common-practice rules on 0.6 m²: scuff/clean/mask 0.6 h + barrier sealer 0.3 h + minor rust 0.6 h + hardware
    // 0.5 h = 2 h; at the demo labour rate of $95/h, 2 h × $95.00 = $190.00.
    await office.page.getByText("2 h × $95.00 = $190.00").waitFor();
    await office.page.getByRole("region", { name: "Photos of Fuel tank" }).waitFor();
    const photo = await sharp({ create: { width: 120, height: 80, channels: 3, background: { r: 120, g: 70, b: 40 } } }).jpeg().toBuffer();
    await office.page.getByRole("region", { name: "Photos of Fuel tank" }).locator("input[type=file]").setInputFiles({ name: "rust.jpg", mimeType: "image/jpeg", buffer: photo });
    await office.page.getByRole("button", { name: /Share .* with the customer/ }).click();
    await office.page.getByRole("button", { name: /Shared .* with the customer/ }).waitFor();
    await waitForQuiet(office.page);
    expect(await seriousViolations(office.page)).toEqual([]);
    await shot(office.page, "intake-inspection.png");

    await office.page.getByRole("button", { name: "Start the quote with the suggested prep line" }).click();
    await office.page.waitForURL(/\/quotes\/\d+$/);
    const quoteId = Number(new URL(office.page.url()).pathname.split("/").pop());
    const quote = await api<{ current: { lines: { description: string; hours?: number; rateCents?: number }[] } }>(office.page, `/api/quotes/${quoteId}`);
    expect(quote.current.lines).toContainEqual(
      expect.objectContaining({ description: "Prep found at intake inspection (Fuel tank: rust (minor), hardware to remove: Tank badges)", hours: 2, rateCents: 9500 }),
    );
    await waitForQuiet(office.page);
    await shot(office.page, "intake-quote-with-prep-line.png");
    await api(office.page, `/api/quotes/${quoteId}/send`, { method: "POST", data: {} });

    // The shop sprays two panels for the job and sends both from the job's colour panel.
    const lighter = await panelWithPhoto(office.page, job.id, 3, { labL: 38, labA: 52, labB: 24 }, { r: 170, g: 30, b: 45 });
    const deeper = await panelWithPhoto(office.page, job.id, 5, { labL: 29, labA: 47, labB: 19 }, { r: 120, g: 18, b: 32 });
    await office.page.goto(`${baseUrl}/jobs/${job.id}`);
    const send = office.page.getByRole("form", { name: "Send panels to the customer" });
    await send.getByLabel(lighter.label).check();
    await send.getByLabel(deeper.label).check();
    await send.getByLabel("Message to the customer (optional)").fill("Two depths of the garnet for you to choose from.");
    await send.getByLabel("Target name").fill("Customer's sample chip");
    await send.getByLabel("L*").fill("30");
    await send.getByLabel("a*").fill("48");
    await send.getByLabel("b*").fill("20");
    await send.getByRole("button", { name: "Send 2 panels to the customer" }).click();
    await office.page.getByRole("list", { name: "Panels sent to the customer" }).getByText("Waiting for the customer").first().waitFor();
    expect(office.errors).toEqual([]);

    // The customer reads the inspection with the quote (the shared photo, not the shop's note), then picks the deeper
    // panel in the portal.
    const customer = await newPage(browser, { width: 390, height: 844 });
    await signIn(customer.page, baseUrl, "customer");
    await customer.page.goto(`${baseUrl}/portal/quotes/${quoteId}`);
    const found = customer.page.getByRole("region", { name: "What we found when we looked your parts over" });
    await found.getByText("rust (minor); hardware to remove: Tank badges").waitFor();
    await found.getByText("Surface rust by the filler neck; the badges come off and go back on.").waitFor();
    await found.getByRole("img", { name: "Photo of Fuel tank" }).waitFor();
    expect(await customer.page.locator("body").innerText()).not.toContain("left knee pad");
    await waitForQuiet(customer.page);
    await shot(customer.page, "portal-quote-inspection.png");
    await customer.page.goto(`${baseUrl}/portal/jobs/${job.id}/colour`);
    await customer.page.getByRole("heading", { name: "Choose your colour" }).waitFor();
    // Each panel with its ΔE00 to the sample the shop entered (the formula is checked against Sharma et al. 2005 in the API tests).
    await expect.poll(() => customer.page.getByText(/^ΔE00 \d+\.\d\d from Customer's sample chip$/).count()).toBe(2);
    await waitForQuiet(customer.page);
    expect(await seriousViolations(customer.page)).toEqual([]);
    await shot(customer.page, "portal-colour-choice.png");
    await customer.page.getByRole("radio", { name: new RegExp(deeper.label) }).check();
    await customer.page.getByLabel("Your name").fill("Tobias Wren");
    await customer.page.getByRole("button", { name: "Approve this colour" }).click();
    await customer.page.getByText(`You approved ${deeper.label} in the portal`, { exact: false }).waitFor();
    await customer.page.getByRole("region", { name: `Agreed colour of job #${job.id}` }).getByText(deeper.label).waitFor();
    await waitForQuiet(customer.page);
    await shot(customer.page, "portal-colour-approved.png");
    expect(customer.errors).toEqual([]);

    // Back in the shop: the job's approved colour is the customer's pick, approved in the portal.
    await office.page.reload();
    const colour = office.page.getByRole("region", { name: "Colour" });
    await colour.getByText("The customer approved the agreed colour in the portal.").waitFor();
    await colour.getByRole("link", { name: deeper.label }).first().waitFor();
    await waitForQuiet(office.page);
    await shot(office.page, "intake-job-approved-colour.png");
    expect(office.errors).toEqual([]);
    await office.close();
    await customer.close();
  });

  it("a panel against the approved one reads in the shop's tolerance words with ΔE00 beside them", async () => {
    const office = await newPage(browser);
    await signIn(office.page, baseUrl, "estimator");
    const customers = await api<{ items: { id: number; name: string }[] }>(office.page, "/api/customers?q=Tobias%20Wren");
    const customerId = customers.items.find((c) => c.name === "Tobias Wren")!.id;
    const job = await api<{ id: number }>(office.page, "/api/jobs", { method: "POST", data: { customerId, title: `Tolerance words E2E ${Date.now()}` } });
    // Sharma, Wu and Dalal (2005), Color Res. Appl. 30(1), Table 1, pair 34: ΔE00 0.9082.
    const panel = (lab: { labL: number; labA: number; labB: number }) =>
      api<{ id: number }>(office.page, "/api/panels", { method: "POST", data: { groundName: "Fine silver", candyName: "Candy garnet", letDownClear: 6, letDownToner: 1, coats: 4, jobId: job.id, ...lab } });
    const approved = await panel({ labL: 2.0776, labA: 0.0795, labB: -1.135 });
    await api(office.page, `/api/jobs/${job.id}/approved-panel`, { method: "PUT", data: { panelId: approved.id } });
    const next = await panel({ labL: 0.9033, labA: -0.0636, labB: -0.5514 });
    const colour = await api<{ thresholds: { deltaEMatch: number; deltaEClose: number } }>(office.page, `/api/jobs/${job.id}/colour`);
    const words = 0.9082 < colour.thresholds.deltaEMatch ? "Within tolerance" : 0.9082 < colour.thresholds.deltaEClose ? "Borderline" : "Out of tolerance";
    await office.page.goto(`${baseUrl}/panels/${next.id}`);
    const badge = office.page.getByText(/\(ΔE00 0\.91\)$/);
    // The badge: the words, then ΔE00 in its own span.
    await expect.poll(() => badge.first().locator("xpath=..").innerText()).toMatch(new RegExp(`^${words}\\s+\\(ΔE00 0\\.91\\)$`));
    expect(await office.page.locator("main").innerText()).not.toMatch(/\b(Match|Close|Different)\b/);
    await office.close();
  });
});
