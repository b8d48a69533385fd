import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser } from "playwright-core";
import path from "node:path";
import { existsSync, statSync } from "node:fs";
import { ARTEFACTS, launch, navNames, newPage, signIn, waitForQuiet } from "./browser";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

describe("first visit", () => {
  it("opening the shop's address shows the sign-in page", async () => {
    const { page, errors, close } = await newPage(browser);
    await page.goto(`${baseUrl}/`);
    await page.waitForURL((u) => u.pathname.startsWith("/sign-in"));
    await expect.poll(() => page.getByRole("button", { name: "Sign in" }).count()).toBe(1);
    expect(errors).toEqual([]);
    await close();
  });
});

describe("each demo role signs in and sees its own navigation", () => {
  const expected = {
    owner: { has: ["Board", "Jobs", "Customers", "Users", "Outbox", "Account"], lacks: [] as string[] },
    estimator: { has: ["Board", "Jobs", "Customers", "Account"], lacks: ["Users", "Outbox"] },
    painter: { has: ["Board", "Jobs", "Account"], lacks: ["Customers", "Users", "Outbox"] },
    customer: { has: ["My jobs"], lacks: ["Board", "Jobs", "Customers", "Users", "Outbox"] },
  };
  for (const [role, nav] of Object.entries(expected) as [keyof typeof expected, (typeof expected)["owner"]][]) {
    it(role, async () => {
      const { page, errors, close } = await newPage(browser);
      await signIn(page, baseUrl, role);
      // The demo-only entries (Outbox) join the menu once the server's settings have arrived: wait for the whole menu.
      await waitForQuiet(page);
      await expect.poll(() => navNames(page)).toEqual(expect.arrayContaining(nav.has));
      const names = await navNames(page);
      for (const n of nav.lacks) expect(names).not.toContain(n);
      await page.getByRole("button", { name: "Sign out" }).click();
      await page.waitForURL((u) => u.pathname.startsWith("/sign-in"));
      expect(errors).toEqual([]);
      await close();
    });
  }

  it("on a shop's own server (not the demo), the owner's menu has no Outbox", async () => {
    const { page, errors, close } = await newPage(browser);
    // The server says it runs with a real mail relay: the demo outbox is not there.
    await page.route(/\/api\/health$/, async (route) => {
      const res = await route.fetch();
      await route.fulfill({ response: res, json: { ...(await res.json()), demoMode: false } });
    });
    await signIn(page, baseUrl, "owner");
    const names = await navNames(page);
    expect(names).toContain("Users");
    expect(names).not.toContain("Outbox");
    expect(errors).toEqual([]);
    await close();
  });
});

describe("jobs", () => {
  it("an estimator creates a job through the form and finds it in the table", async () => {
    const { page, errors, close } = await newPage(browser);
    await signIn(page, baseUrl, "estimator");
    await page.goto(`${baseUrl}/jobs`);
    await page.getByRole("link", { name: "New job" }).or(page.getByRole("button", { name: "New job" })).first().click();
    const title = `Pinstriped tank E2E ${Date.now()}`;
    // Submitting empty shows the field errors beside the fields.
    await page.getByRole("button", { name: "Create job" }).click();
    await expect.poll(() => page.getByText("Title is required").count()).toBeGreaterThan(0);
    // The customer picker searches on the server as the user types, and works from the keyboard.
    const customer = page.getByRole("combobox", { name: "Customer" });
    await customer.click();
    await customer.pressSequentially("imog");
    const list = page.getByRole("listbox", { name: "Customer" });
    await expect.poll(() => list.getByRole("option").allInnerTexts()).toEqual([expect.stringMatching(/^Imogen Castellan/)]);
    expect(await customer.getAttribute("aria-expanded")).toBe("true");
    await customer.press("ArrowDown");
    await customer.press("ArrowUp");
    await expect.poll(async () => (await customer.getAttribute("aria-activedescendant")) === (await list.getByRole("option").first().getAttribute("id"))).toBe(true);
    await customer.press("Enter");
    expect(await customer.getAttribute("aria-expanded")).toBe("false");
    expect(await customer.inputValue()).toBe("Imogen Castellan");
    await page.getByLabel("Title").fill(title);
    await page.getByLabel("Due date").fill("2027-03-15");
    await page.getByLabel("Painter").selectOption({ label: "Marco Vell" });
    await page.getByRole("button", { name: "Create job" }).click();
    await page.waitForURL(/\/jobs\/\d+$/);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toContain(title);

    await page.goto(`${baseUrl}/jobs`);
    await page.getByLabel("Search jobs").fill("Pinstriped tank E2E");
    await expect.poll(() => page.getByRole("table").innerText(), { timeout: 10_000 }).toContain(title);
    expect(new URL(page.url()).searchParams.get("q")).toBe("Pinstriped tank E2E");
    expect(errors).toEqual([]);
    await close();
  });

  it("the owner's board shows every stage; a screenshot is saved as an artefact", async () => {
    const { page, errors, close } = await newPage(browser, { width: 1280, height: 900 });
    await signIn(page, baseUrl, "owner");
    await page.goto(`${baseUrl}/board`);
    for (const stage of ["Inquiry", "Quoted", "Booked", "In prep", "In booth", "Curing", "Finishing", "Ready"]) {
      await expect.poll(() => page.getByRole("heading", { name: new RegExp(`^${stage}`) }).count()).toBeGreaterThan(0);
    }
    const file = path.join(ARTEFACTS, "board.png");
    await page.screenshot({ path: file, fullPage: false });
    expect(existsSync(file) && statSync(file).size > 10_000).toBe(true);
    expect(errors).toEqual([]);
    await close();
  });

  it("while the next screen loads, a bar shows at the top and the current screen stays", async () => {
    // Without the service worker: it would answer the scripts from its cache, past the slow network below.
    const { page, errors, close } = await newPage(browser, { width: 1280, height: 900 }, { serviceWorkers: "block" });
    await signIn(page, baseUrl, "owner");
    await page.goto(`${baseUrl}/board`);
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText()).toBe("Board");
    const bar = page.getByRole("progressbar", { name: "Opening the next screen" });
    expect(await bar.count()).toBe(0);
    // A slow link: every script the next screen needs takes a second and a half to arrive.
    await page.route(/\/assets\/.*\.js$/, async (route) => {
      await new Promise((resolve) => setTimeout(resolve, 1500));
      await route.continue();
    });
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Customers" }).click();
    await expect.poll(() => bar.isVisible()).toBe(true);
    expect(await page.getByRole("heading", { level: 1 }).innerText()).toBe("Board");
    await expect.poll(() => page.getByRole("heading", { level: 1 }).innerText(), { timeout: 15_000 }).toBe("Customers");
    expect(await bar.count()).toBe(0);
    expect(errors).toEqual([]);
    await close();
  });

  it("a customer sees only their own jobs in the portal", async () => {
    const { page, errors, close } = await newPage(browser, { width: 390, height: 844 });
    await signIn(page, baseUrl, "customer");
    // Wait for the portal's job list to render before reading it.
    await expect.poll(() => page.getByRole("main").innerText(), { timeout: 15_000 }).toMatch(/Motorcycle|helmet|Guitar|hood|Golf|frame|covers|scoop|mirror/i);
    const text = await page.getByRole("main").innerText();
    expect(text).not.toContain("Imogen Castellan");
    expect(errors).toEqual([]);
    await close();
  });
});
