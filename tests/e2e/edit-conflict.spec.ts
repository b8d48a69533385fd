import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import { ARTEFACTS, launch, newPage, signIn } from "./browser";
import type { PlanDto } from "../../shared/schemas/plan.schema";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** The estimator renames the plan from their own session, from the version they read. */
async function renameAsEstimator(estimator: Page, id: number, name: string) {
  const plan = (await (await estimator.request.get(`${baseUrl}/api/plans/${id}`)).json()) as PlanDto;
  const doc = { name, description: plan.description, layers: plan.latest.layers, version: plan.version };
  const res = await estimator.request.put(`${baseUrl}/api/plans/${id}`, { data: doc });
  expect(res.status(), await res.text()).toBe(200);
}

describe("two people editing one plan", () => {
  it("the owner's save after the estimator's says who changed it and when, keeps what was typed, and saves it over theirs or loads theirs", async () => {
    const owner = await newPage(browser, { width: 1280, height: 1000 });
    const estimator = await newPage(browser);
    await signIn(owner.page, baseUrl, "owner");
    await signIn(estimator.page, baseUrl, "estimator");
    const templates = (await (await owner.page.request.get(`${baseUrl}/api/plans?kind=template`)).json()) as { id: number; name: string }[];
    // A copy of its own to rename: the demo templates are shared with the other browser tests, which pick them by name.
    const copied = await estimator.page.request.post(`${baseUrl}/api/plans/${templates[0]!.id}/copy-as-template`, { data: { name: `E2E conflict ${Date.now()}` } });
    expect(copied.status(), await copied.text()).toBe(201);
    const plan = (await copied.json()) as { id: number };

    // The owner opens the editor and types a new name; meanwhile the estimator saves a change of their own.
    await owner.page.goto(`${baseUrl}/plans/${plan.id}/edit`);
    const name = owner.page.getByLabel("Plan name");
    await name.waitFor();
    await name.fill("Owner's name for it");
    await renameAsEstimator(estimator.page, plan.id, "Estimator's name for it");
    await owner.page.getByRole("button", { name: "Save plan" }).click();

    const notice = owner.page.getByRole("status").filter({ hasText: "Rosa Penhallow changed this plan at" });
    await notice.waitFor();
    expect(await name.inputValue()).toBe("Owner's name for it");
    expect(new URL(owner.page.url()).pathname).toBe(`/plans/${plan.id}/edit`);
    await owner.page.screenshot({ path: path.join(ARTEFACTS, "edit-conflict.png") });

    // Save mine over theirs: the owner's name is kept, and the plan page shows it.
    await notice.getByRole("button", { name: "Save mine over theirs" }).click();
    await owner.page.waitForURL(new RegExp(`/plans/${plan.id}$`));
    await owner.page.getByRole("heading", { level: 1, name: "Owner's name for it" }).waitFor();

    // Once more, and this time load theirs: the field shows the estimator's name.
    await owner.page.goto(`${baseUrl}/plans/${plan.id}/edit`);
    await name.waitFor();
    await name.fill("Another name");
    await renameAsEstimator(estimator.page, plan.id, "The estimator's again");
    await owner.page.getByRole("button", { name: "Save plan" }).click();
    await notice.waitFor();
    await notice.getByRole("button", { name: "Load their version" }).click();
    await expect.poll(() => name.inputValue()).toBe("The estimator's again");
    // The browser logs each refused save (409) itself; nothing else went wrong.
    expect(owner.errors.filter((e) => !e.includes("status of 409"))).toEqual([]);
    expect(owner.errors).toHaveLength(2);
    await owner.close();
    await estimator.close();
  });
});
