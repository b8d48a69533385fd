import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import path from "node:path";
import { ARTEFACTS, launch, newPage, signIn, waitForQuiet } from "./browser";
import type { SchedulableJobDto, ScheduleDto } from "../../shared/schemas/schedule.schema";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

async function api<T>(page: Page, method: "GET" | "DELETE", url: string): Promise<T | null> {
  const res = await page.request.fetch(`${baseUrl}${url}`, { method });
  expect(res.status(), `${method} ${url}`).toBeLessThan(300);
  return res.status() === 204 ? null : ((await res.json()) as T);
}

/** The Monday five weeks after this week's, 09:00 on the browser's clock: clear of the demo's booked two weeks. */
function targetMonday() {
  const d = new Date();
  d.setHours(9, 0, 0, 0);
  d.setDate(d.getDate() - ((d.getDay() + 6) % 7) + 35);
  return d;
}
const localInput = (d: Date) => {
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
};

describe("booth schedule", () => {
  it("the office books two jobs into one booth at once, sees the conflict, moves one (keyboard, then drag) and sees it cleared", async () => {
    const { page, errors, close } = await newPage(browser, { width: 1400, height: 1000 });
    await signIn(page, baseUrl, "owner");
    // Two jobs with layers to spray; their demo bookings are cleared so only what this test books is theirs.
    const jobs = (await api<SchedulableJobDto[]>(page, "GET", "/api/schedule/jobs"))!.filter((j) => j.layers.length > 0).slice(0, 2);
    expect(jobs).toHaveLength(2);
    const now = Date.now();
    const booked = (await api<ScheduleDto>(page, "GET", `/api/schedule?from=${new Date(now - 86_400_000).toISOString()}&to=${new Date(now + 40 * 86_400_000).toISOString()}`))!;
    for (const s of booked.sessions.filter((x) => jobs.some((j) => j.id === x.jobId))) await api(page, "DELETE", `/api/schedule/sessions/${s.id}`);

    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Schedule" }).click();
    await page.getByRole("heading", { level: 1, name: "Booth schedule" }).waitFor();
    const monday = targetMonday();
    const [first, second] = jobs as [SchedulableJobDto, SchedulableJobDto];
    for (const [job, start] of [
      [first, monday],
      [second, new Date(monday.getTime() + 30 * 60_000)],
    ] as const) {
      const card = page.getByRole("article", { name: job.title });
      await card.getByLabel("Booth").selectOption({ label: "North booth" });
      await card.getByLabel("Starts").fill(localInput(start));
      await card.getByRole("button", { name: `Book a layer of ${job.title}` }).click();
      await page.getByText(/^Booked/).first().waitFor();
    }

    for (let i = 0; i < 5; i++) await page.getByRole("button", { name: "Next week" }).click();
    await waitForQuiet(page);
    const overlap = `North booth is booked twice at once: ${first.title} and ${second.title}`;
    const conflicts = page.getByRole("list", { name: "Conflicts" });
    await expect.poll(() => conflicts.getByText(overlap).count()).toBe(1);
    await page.screenshot({ path: path.join(ARTEFACTS, "schedule-conflict.png"), fullPage: true });

    // Keyboard: focus the second job's session, move it down to the side booth, save.
    // (Chromium may put a space between the block's lines when it reads the name out.)
    const block = page.getByRole("button", { name: new RegExp(`^${second.title}\\s?, ${second.layers[0]!.name}\\s?:`) });
    await block.focus();
    await page.keyboard.press("ArrowDown");
    await page.keyboard.press("Enter");
    await expect.poll(() => page.getByText(overlap).count()).toBe(0);

    // Drag, in the day view: back up into the north booth, onto the first job's time: the conflict is back.
    await page.getByRole("button", { name: `Show ${new Intl.DateTimeFormat(undefined, { weekday: "short", day: "numeric", month: "short" }).format(monday)} by the hour` }).click();
    await page.getByRole("heading", { name: new Intl.DateTimeFormat(undefined, { weekday: "short", day: "numeric", month: "short" }).format(monday) }).waitFor();
    const box = (await block.boundingBox())!;
    await page.mouse.move(box.x + 10, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + 10, box.y + box.height / 2 - 40, { steps: 4 });
    await page.mouse.move(box.x + 10, box.y + box.height / 2 - 72, { steps: 4 });
    await page.mouse.up();
    await expect.poll(() => conflicts.getByText(overlap).count()).toBe(1);
    await page.screenshot({ path: path.join(ARTEFACTS, "schedule-dragged.png"), fullPage: true });
    expect(errors).toEqual([]);
    await close();
  });

  it("the painter sees today's booth time on the booth page and the board shows booked jobs' next slot", async () => {
    const { page, errors, close } = await newPage(browser);
    await signIn(page, baseUrl, "owner");
    await page.goto(`${baseUrl}/board`);
    await page.getByRole("heading", { level: 1, name: "Board" }).waitFor();
    await expect.poll(() => page.getByText("Next booth slot:").count()).toBeGreaterThan(0);
    await close();

    const painter = await newPage(browser);
    await signIn(painter.page, baseUrl, "painter");
    await painter.page.goto(`${baseUrl}/booth`);
    await painter.page.getByRole("heading", { name: "Your booth time today" }).waitFor();
    expect(errors).toEqual([]);
    expect(painter.errors).toEqual([]);
    await painter.close();
  });
});
