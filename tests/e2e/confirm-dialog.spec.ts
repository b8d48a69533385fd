import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser } from "playwright-core";
import { launch, newPage, signIn } from "./browser";
import { call } from "./booth-setup";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("are you sure?", () => {
  it("a refusal from the server stays in the dialog with its reason; going ahead then deletes and says so", async () => {
    const { page, errors, close } = await newPage(browser);
    await signIn(page, baseUrl, "estimator");
    const customers = await call<{ items: { id: number }[] }>(page, "GET", "/api/customers?pageSize=1");
    const job = await call<{ id: number }>(page, "POST", "/api/jobs", { customerId: customers.items[0]!.id, title: `E2E confirm ${Date.now()}` });
    await page.goto(`${baseUrl}/jobs/${job.id}`);
    await page.getByRole("button", { name: "Delete", exact: true }).click();
    const dialog = page.getByRole("dialog", { name: `Delete job #${job.id}?` });
    await dialog.waitFor();

    // Meanwhile someone sends it a quote: the job is no longer an inquiry, and the server refuses.
    await call(page, "POST", `/api/jobs/${job.id}/stage`, { stage: "quoted" });
    await dialog.getByRole("button", { name: "Delete job" }).click();
    await expect.poll(() => dialog.getByRole("alert").innerText()).toMatch(/Not done/);
    expect(await dialog.innerText()).toMatch(/Only an inquiry can be deleted/);
    expect(page.url()).toMatch(new RegExp(`/jobs/${job.id}$`));

    // Back to an inquiry, the same button deletes it and the table is shown with a message.
    await call(page, "POST", `/api/jobs/${job.id}/stage`, { stage: "inquiry" });
    await dialog.getByRole("button", { name: "Delete job" }).click();
    await page.waitForURL(/\/jobs$/);
    await expect.poll(() => page.getByText(`Deleted job #${job.id}`).count()).toBe(1);
    expect(errors.filter((e) => !/status of 409/.test(e))).toEqual([]);
    await close();
  });
});
