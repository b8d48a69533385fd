import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import path from "node:path";
import type { Browser } from "playwright-core";
import { ARTEFACTS, launch, navNames, newPage, signIn, waitForQuiet } from "./browser";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

type Payment = { id: number; amountCents: number; refundedCents: number; needsReview: boolean; customerName: string; flagReason: string | null };

describe("payments screen", () => {
  it("the owner finds the payments to check first and a refund of all that is left one dialog away; the estimator has no such screen", async () => {
    const { page, errors, close } = await newPage(browser);
    await signIn(page, baseUrl, "owner");
    expect(await navNames(page)).toContain("Payments");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Payments" }).click();
    await page.getByRole("heading", { level: 1, name: "Payments" }).waitFor();
    await waitForQuiet(page);

    // The API's list, as the screen shows it: those to check (the demo shop has a short card payment) come first.
    const all = (await (await page.request.get(`${baseUrl}/api/payments`)).json()) as { items: Payment[] };
    const toCheck = all.items.filter((p) => p.needsReview);
    expect(toCheck.length).toBeGreaterThan(0);
    expect(all.items.slice(0, toCheck.length).every((p) => p.needsReview)).toBe(true);
    await page.locator("label", { hasText: `To check (${toCheck.length})` }).click();
    await page.waitForURL(/show=to-check/);
    const rows = page.getByRole("table", { name: "Payments to check" }).locator("tbody tr");
    await expect.poll(() => rows.count()).toBe(toCheck.length);

    const first = toCheck[0]!;
    const left = first.amountCents - first.refundedCents;
    const amount = `$${(left / 100).toFixed(2)}`;
    await page.getByRole("button", { name: `Refund ${amount} of payment #${first.id} to ${first.customerName}` }).click();
    const dialog = page.getByRole("dialog", { name: "Refund a payment" });
    await dialog.waitFor();
    expect(await dialog.getByLabel("Amount to refund").inputValue()).toBe((left / 100).toFixed(2));
    expect(await dialog.getByRole("button", { name: `Refund ${amount}` }).isEnabled()).toBe(true);
    // The reason offered is the one the payment was flagged for (the demo's is a short payment, not an extra one).
    expect(await dialog.getByLabel("Reason (optional)").inputValue()).toMatch(/^Paid \$[\d,.]+ but the deposit asked was \$[\d,.]+$/);
    await page.screenshot({ path: path.join(ARTEFACTS, "payments-refund-dialog.png") });
    await dialog.getByRole("button", { name: "Cancel" }).click();
    expect(errors).toEqual([]);
    await close();

    const estimator = await newPage(browser);
    await signIn(estimator.page, baseUrl, "estimator");
    expect(await navNames(estimator.page)).not.toContain("Payments");
    await estimator.close();
  });
});
