import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import path from "node:path";
import sharp from "sharp";
import { ARTEFACTS, launch, newPage, signIn } from "./browser";
import { call, jobReadyForTheBooth } from "./booth-setup";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

type Coat = { id: number; coatNumber: number; layerName: string; at: string; loggedAt: string; status: string };
type Entry = { key: string; kind: string; label: string; path: string; body: Record<string, unknown>; madeAt: number; state: string; waitsFor?: string };
type Photo = { id: number; ownerType: string; ownerId: number; size: number; takenAt: string; createdAt: string };

/** The tablet's queue as stored in IndexedDB (src/lib/offline/queue.ts), read from inside the page. */
function storedQueue(page: Page): Promise<Entry[]> {
  return page.evaluate(
    () =>
      new Promise<Entry[]>((resolve, reject) => {
        const open = indexedDB.open("coatwright-queue");
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const all = open.result.transaction("entries").objectStore("entries").getAll();
          all.onsuccess = () => resolve((all.result as Entry[][]).flat());
          all.onerror = () => reject(all.error);
        };
      }),
  );
}

/** How many booth answers the tablet keeps in IndexedDB (src/lib/offline/persist.ts). */
function cachedQueries(page: Page): Promise<string[]> {
  return page.evaluate(
    () =>
      new Promise<string[]>((resolve) => {
        const open = indexedDB.open("coatwright-cache");
        open.onsuccess = () => {
          const db = open.result;
          if (!db.objectStoreNames.contains("queries")) return resolve([]);
          const all = db.transaction("queries").objectStore("queries").getAll();
          all.onsuccess = () => resolve((all.result as { clientState: { queries: { queryKey: unknown[] }[] } }[]).flatMap((c) => c.clientState.queries.map((q) => JSON.stringify(q.queryKey))));
        };
        open.onerror = () => resolve([]);
      }),
  );
}

/** A POST with an Idempotency-Key from inside the page (the painter's session): status, whether it was a replay, body. */
function replay(page: Page, entry: Entry) {
  return page.evaluate(
    async (e) => {
      const r = await fetch(`/api${e.path}`, { method: "POST", headers: { "Content-Type": "application/json", "Idempotency-Key": e.key }, body: JSON.stringify(e.body) });
      return { status: r.status, replayed: r.headers.get("Idempotent-Replayed") };
    },
    entry,
  );
}

const coatsOf = async (page: Page, jobId: number) => (await call<Coat[]>(page, "GET", `/api/coat-logs?jobId=${jobId}`)).filter((c) => c.status !== "correction");

/** A browser's own complaints about the missing network are expected while offline; anything else is not. */
const realErrors = (errors: string[]) => errors.filter((e) => !/ERR_INTERNET_DISCONNECTED|Failed to fetch|net::ERR_FAILED|status of 409/.test(e));

/** A fresh job's booth card on the painter's tablet, opened online, with the service worker in control and the card kept. */
async function painterAtTheCard() {
  const jobId = await jobReadyForTheBooth(browser, baseUrl);
  const { page, errors, close } = await newPage(browser, { width: 820, height: 1180 });
  await signIn(page, baseUrl, "painter");

  // Online first: the booth list (the installed app's start page) fetches every card of the painter's jobs.
  await page.goto(`${baseUrl}/booth`);
  await page.getByRole("main").locator(`a[href="/booth/${jobId}"]`).waitFor();
  await page.goto(`${baseUrl}/booth/${jobId}`);
  const nextCoat = page.getByTestId("next-coat");
  await expect.poll(() => nextCoat.innerText()).toBe("Coat 1 of 1");
  // The service worker has the app shell and controls the page; the card is kept on the tablet.
  await page.evaluate(() => navigator.serviceWorker.ready);
  await expect.poll(() => page.evaluate(() => navigator.serviceWorker.controller !== null), { timeout: 20_000 }).toBe(true);
  await expect.poll(() => cachedQueries(page), { timeout: 10_000 }).toContain(JSON.stringify(["booth", "card", jobId]));
  return { jobId, page, errors, close, context: page.context(), nextCoat };
}

describe("the booth card without Wi-Fi", () => {
  it("logs three coats offline, keeps them over a reload, sends them once when back online, and shows a refused entry", async () => {
    const { jobId, page, errors, close, context, nextCoat } = await painterAtTheCard();
    const nextLayer = page.getByTestId("next-layer");

    // The Wi-Fi drops. Three coats: the sealer's only coat, then two of the metallic ground.
    await context.setOffline(true);
    const banner = page.getByTestId("offline-banner");
    await expect.poll(() => banner.innerText()).toMatch(/^Offline/);
    const logButton = page.getByRole("button", { name: /^Log coat/ });
    const reason = page.getByLabel("Reason for going ahead against the timing rule");
    /** A tap; inside a dry or flash time the tablet itself asks for the reason (no server to refuse it), then a second tap. */
    const tap = async (againstTiming: boolean) => {
      // A double tap (gloves, a sticky screen) is one coat: the next coat's button is held back for a moment.
      await logButton.dblclick();
      if (!againstTiming) return;
      await expect.poll(() => page.getByRole("form", { name: "Log a coat" }).getByRole("alert").innerText()).toMatch(/^Not logged: .*Give a reason to go ahead\./);
      await reason.fill("Flashed by eye, offline test");
      await logButton.click();
    };
    const taps: { before: number; after: number }[] = [];
    for (const [expected, againstTiming] of [["Coat 1 of 3", false], ["Coat 2 of 3", true], ["Coat 3 of 3", true]] as const) {
      const before = Date.now();
      await tap(againstTiming);
      await expect.poll(() => nextCoat.innerText()).toBe(expected);
      taps.push({ before, after: Date.now() });
    }
    expect(await nextLayer.innerText()).toBe("Metallic ground");
    expect(await banner.innerText()).toBe("Offline: 3 entries waiting to send");
    // The flash timer runs from the offline tap.
    expect(await page.getByRole("timer", { name: "Flash time left" }).isVisible()).toBe(true);
    expect(await storedQueue(page)).toHaveLength(3);

    // A reload with no network: the card is still there, moved on over the three waiting coats.
    await page.reload();
    await expect.poll(() => nextCoat.innerText(), { timeout: 15_000 }).toBe("Coat 3 of 3");
    expect(await nextLayer.innerText()).toBe("Metallic ground");
    await expect.poll(() => banner.innerText()).toBe("Offline: 3 entries waiting to send");
    const onTablet = page.getByRole("list", { name: "Entries on this tablet" });
    expect(await onTablet.getByRole("listitem").count()).toBe(3);
    expect(await onTablet.innerText()).toMatch(/Coat 1 of Sealer[\s\S]*Coat 1 of Metallic ground[\s\S]*Coat 2 of Metallic ground/);
    await page.screenshot({ path: path.join(ARTEFACTS, "offline-booth-waiting.png") });
    const queued = await storedQueue(page);
    expect(queued.map((e) => e.state)).toEqual(["waiting", "waiting", "waiting"]);

    // Back online: the queue goes out in order, then "All sent".
    await context.setOffline(false);
    await expect.poll(() => banner.innerText(), { timeout: 20_000 }).toBe("All sent");
    const coats = await coatsOf(page, jobId);
    expect(coats.map((c) => `${c.coatNumber} ${c.layerName}`)).toEqual(["1 Sealer", "1 Metallic ground", "2 Metallic ground"]);
    // Each keeps the time it was made on the tablet (not when it arrived), within its tap.
    coats.forEach((c, i) => {
      const at = Date.parse(c.at);
      expect(at).toBeGreaterThanOrEqual(taps[i]!.before - 2000);
      expect(at).toBeLessThanOrEqual(taps[i]!.after + 2000);
      expect(Date.parse(c.loggedAt)).toBeGreaterThan(at);
    });
    expect(coats.map((c) => Date.parse(c.at))).toEqual(queued.map((e) => e.madeAt));

    // The same queue sent again (a reply lost on the way back, a second tablet): the server stores each key once.
    for (const entry of queued) expect(await replay(page, entry)).toEqual({ status: 201, replayed: "true" });
    expect(await coatsOf(page, jobId)).toHaveLength(3);
    await expect.poll(() => nextCoat.innerText()).toBe("Coat 3 of 3");

    // Offline again: coat 3 is logged on the tablet, while the owner logs coat 3 from the office in the meantime.
    await context.setOffline(true);
    await expect.poll(() => banner.innerText()).toMatch(/^Offline/);
    await tap(true);
    await expect.poll(() => banner.innerText()).toBe("Offline: 1 entry waiting to send");
    const office = await newPage(browser);
    await signIn(office.page, baseUrl, "owner");
    const card = await call<{ next: { layerId: number; coat: number } }>(office.page, "GET", `/api/jobs/${jobId}/booth`);
    await call(office.page, "POST", "/api/coat-logs", { jobId, layerId: card.next.layerId, coatNumber: card.next.coat, timingOverrideReason: "Sprayed from the office test" });
    await office.close();

    // Back online, the server refuses the tablet's coat 3 (it is already logged): the painter sees why, and what to do.
    await context.setOffline(false);
    const refused = page.locator("p", { hasText: /^Not accepted:/ });
    await expect.poll(() => refused.isVisible(), { timeout: 20_000 }).toBe(true);
    expect(await refused.innerText()).toMatch(/The next coat is coat 1 of \d+ of .*; the card was out of date, so nothing was logged/);
    expect(await banner.innerText()).toMatch(/1 entry not accepted by the server: fix or discard on the booth card/);
    expect(await page.getByRole("button", { name: "Discard" }).isVisible()).toBe(true);
    await expect.poll(() => page.getByRole("button", { name: /^Send as coat 1 of / }).isVisible(), { timeout: 10_000 }).toBe(true);
    await page.screenshot({ path: path.join(ARTEFACTS, "offline-booth-refused.png"), fullPage: true });
    expect(await coatsOf(page, jobId)).toHaveLength(4);

    // Signing out with an entry still on the tablet asks first; declining keeps the painter signed in.
    const asked: string[] = [];
    page.once("dialog", (d) => {
      asked.push(d.message());
      void d.dismiss();
    });
    await page.getByRole("button", { name: "Sign out" }).click();
    await expect.poll(() => asked.length).toBe(1);
    expect(asked[0]).toMatch(/1 entry is still waiting to send\. Signing out deletes it from this tablet/);
    expect(new URL(page.url()).pathname).toBe(`/booth/${jobId}`);

    // Discarded on purpose, it is gone from the tablet; nothing else was logged.
    page.once("dialog", (d) => void d.accept());
    await page.getByRole("button", { name: "Discard" }).click();
    await expect.poll(async () => (await storedQueue(page)).length).toBe(0);
    expect(await coatsOf(page, jobId)).toHaveLength(4);

    // Signing out wipes the tablet's booth cache.
    page.once("dialog", (d) => void d.accept());
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(/\/sign-in/);
    expect(await cachedQueries(page)).toEqual([]);
    expect(realErrors(errors)).toEqual([]);
    await close();
  });

  it("keeps a correction and booth photos made offline (one of a coat also made offline) over a reload, and sends each exactly once", async () => {
    const { jobId, page, errors, close, context, nextCoat } = await painterAtTheCard();

    // The sealer's coat is logged while the Wi-Fi is up; then the Wi-Fi drops.
    await page.getByRole("button", { name: /^Log coat/ }).click();
    await expect.poll(() => nextCoat.innerText()).toBe("Coat 1 of 3");
    const [sealerCoat] = await coatsOf(page, jobId);
    await context.setOffline(true);
    const banner = page.getByTestId("offline-banner");
    await expect.poll(() => banner.innerText()).toMatch(/^Offline/);

    // A correction of the humidity, and a photo of the coat, both made offline.
    await page.getByRole("button", { name: "Correct coat 1 of Sealer" }).click();
    const dialog = page.getByRole("dialog");
    await dialog.getByLabel("What is wrong, and why").fill("Humidity read off the wrong gauge");
    await dialog.getByLabel("Humidity %").fill("47");
    await dialog.getByRole("button", { name: "Save correction" }).click();
    await expect.poll(() => dialog.count()).toBe(0);
    const jpeg = await sharp({ create: { width: 160, height: 120, channels: 3, background: { r: 140, g: 20, b: 40 } } }).jpeg().toBuffer();
    const before = Date.now();
    await page.getByLabel("Photo of this coat").setInputFiles({ name: "sealer.jpg", mimeType: "image/jpeg", buffer: jpeg });
    await expect.poll(() => banner.innerText()).toBe("Offline: 2 entries waiting to send");
    const after = Date.now();

    // Then a coat of the ground, logged offline (inside the sealer's flash, so with a reason), and a photo of it: the
    // coat has no id yet, so its photo waits in the queue for the coat's answer.
    const logButton = page.getByRole("button", { name: /^Log coat/ });
    await logButton.click();
    await expect.poll(() => page.getByRole("form", { name: "Log a coat" }).getByRole("alert").innerText()).toMatch(/^Not logged: .*Give a reason to go ahead\./);
    await page.getByLabel("Reason for going ahead against the timing rule").fill("Flashed by eye, offline test");
    await logButton.click();
    await expect.poll(() => nextCoat.innerText()).toBe("Coat 2 of 3");
    const groundJpeg = await sharp({ create: { width: 160, height: 120, channels: 3, background: { r: 90, g: 90, b: 100 } } }).jpeg().toBuffer();
    await page.getByLabel("Photo of this coat").setInputFiles({ name: "ground.jpg", mimeType: "image/jpeg", buffer: groundJpeg });
    await expect.poll(() => banner.innerText()).toBe("Offline: 4 entries waiting to send");
    const queued = await storedQueue(page);
    expect(queued.map((e) => [e.kind, e.label, e.state])).toEqual([
      ["correction", "Correction of coat 1 of Sealer", "waiting"],
      ["photo", "Photo of coat 1 of Sealer", "waiting"],
      ["coat", "Coat 1 of Metallic ground", "waiting"],
      ["photo", "Photo of coat 1 of Metallic ground", "waiting"],
    ]);
    const photoEntry = queued[1]!;
    expect(photoEntry.body).toMatchObject({ ownerType: "coat_log", ownerId: sealerCoat!.id });
    expect(queued[3]!.waitsFor).toBe(queued[2]!.key);
    expect(queued[3]!.body).not.toHaveProperty("ownerId");
    expect(new Set(queued.map((e) => e.key)).size).toBe(4);

    // A reload with no network: all four are still on the tablet, the photos with their pictures.
    await page.reload();
    await expect.poll(() => banner.innerText(), { timeout: 15_000 }).toBe("Offline: 4 entries waiting to send");
    expect(await page.getByRole("list", { name: "Entries on this tablet" }).innerText()).toMatch(
      /Correction of coat 1 of Sealer[\s\S]*Photo of coat 1 of Sealer[\s\S]*Coat 1 of Metallic ground[\s\S]*Photo of coat 1 of Metallic ground/,
    );
    const storedBytes = await page.evaluate(
      () =>
        new Promise<number>((resolve, reject) => {
          const open = indexedDB.open("coatwright-queue");
          open.onsuccess = () => {
            const all = open.result.transaction("entries").objectStore("entries").getAll();
            all.onsuccess = () => resolve((all.result as { file?: { blob: Blob } }[][]).flat().find((e) => e.file)?.file?.blob.size ?? 0);
          };
          open.onerror = () => reject(open.error);
        }),
    );
    expect(storedBytes).toBe(jpeg.length);

    // Back online: all go out in order, once.
    await context.setOffline(false);
    await expect.poll(() => banner.innerText(), { timeout: 20_000 }).toBe("All sent");
    const photos = await call<Photo[]>(page, "GET", `/api/uploads?ownerType=coat_log&ownerId=${sealerCoat!.id}`);
    expect(photos).toHaveLength(1);
    expect(photos[0]!.size).toBeGreaterThan(0);
    // It keeps the time it was taken on the tablet, not when it arrived.
    expect(Date.parse(photos[0]!.takenAt)).toBe(photoEntry.madeAt);
    expect(photoEntry.madeAt).toBeGreaterThanOrEqual(before - 2000);
    expect(photoEntry.madeAt).toBeLessThanOrEqual(after + 2000);
    expect(Date.parse(photos[0]!.createdAt)).toBeGreaterThan(photoEntry.madeAt);
    const corrections = (await call<(Coat & { correctsId: number | null; humidityPct: number | null })[]>(page, "GET", `/api/coat-logs?jobId=${jobId}`)).filter((c) => c.status === "correction");
    expect(corrections.map((c) => [c.correctsId, c.humidityPct])).toEqual([[sealerCoat!.id, 47]]);
    // The coat made offline has its one photo, taken after it.
    const groundCoat = (await coatsOf(page, jobId)).find((c) => c.layerName === "Metallic ground" && c.coatNumber === 1)!;
    const groundPhotos = await call<Photo[]>(page, "GET", `/api/uploads?ownerType=coat_log&ownerId=${groundCoat.id}`);
    expect(groundPhotos.map((p) => [p.ownerId, Date.parse(p.takenAt)])).toEqual([[groundCoat.id, queued[3]!.madeAt]]);
    expect(Date.parse(groundCoat.at)).toBe(queued[2]!.madeAt);

    // The same photo sent again under its key (a reply lost on the way back): the first answer, still one photo.
    const again = await page.evaluate(
      async ({ key, body, bytes }) => {
        const form = new FormData();
        for (const [k, v] of Object.entries(body)) form.set(k, String(v));
        form.set("file", new Blob([new Uint8Array(bytes)], { type: "image/jpeg" }), "sealer.jpg");
        const r = await fetch("/api/uploads", { method: "POST", headers: { "Idempotency-Key": key }, body: form });
        return { status: r.status, replayed: r.headers.get("Idempotent-Replayed"), id: ((await r.json()) as { id: number }).id };
      },
      { key: photoEntry.key, body: photoEntry.body, bytes: [...jpeg] },
    );
    expect(again).toEqual({ status: 201, replayed: "true", id: photos[0]!.id });
    expect(await call<Photo[]>(page, "GET", `/api/uploads?ownerType=coat_log&ownerId=${sealerCoat!.id}`)).toHaveLength(1);
    expect(await storedQueue(page)).toEqual([]);
    expect(realErrors(errors)).toEqual([]);
    await close();
  });
});
