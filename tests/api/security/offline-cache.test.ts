import { describe, expect, it } from "vitest";
import { dehydrate, QueryClient, type QueryKey } from "@tanstack/react-query";
import { makeShop } from "../../support/test-app";
import { addMixedSheet, readyForBooth } from "../../support/booth-fixtures";
import { keyPaths } from "../../support/demo-shop";
import { isMoneyKey, listedNotMoney } from "./money-keys";
import { BOOTH_JOB_LIST, keepOnTablet } from "../../../src/app/offline-keys";

/**
 * What a painter's tablet writes to IndexedDB for offline use is the query cache filtered by keepOnTablet
 * (src/lib/offline/persist.ts dehydrates with it). Here the cache holds the painter's booth answers from the API and,
 * beside them, answers only the office sees (a job with its money, the materials with their costs); the kept part is
 * walked with the painter money-key walker.
 */
describe("the painter's offline cache", () => {
  it("keeps the booth queries and no money key, and leaves other screens' answers out", async () => {
    const s = await makeShop();
    const plan = readyForBooth(s);
    addMixedSheet(s, s.jobA.id, plan.version.id, plan.layers[0]!.id, Date.now() - 60_000);
    const client = new QueryClient();
    const put = async (key: QueryKey, who: "painter" | "owner", url: string) => {
      const res = await s.as(who).get(url);
      expect(res.status, url).toBe(200);
      client.setQueryData(key, res.body);
      return res.body as unknown;
    };
    const q = new URLSearchParams({ stage: BOOTH_JOB_LIST.stage.join(","), sort: BOOTH_JOB_LIST.sort, pageSize: String(BOOTH_JOB_LIST.pageSize) });
    // The painter's booth screens (the query keys of features/auth, booth, prep, jobs and lib/server-status).
    await put(["auth", "me"], "painter", "/api/auth/me");
    await put(["server-status"], "painter", "/api/health");
    await put(["jobs", "list", BOOTH_JOB_LIST], "painter", `/api/jobs?${q}`);
    await put(["booth", "card", s.jobA.id], "painter", `/api/jobs/${s.jobA.id}/booth`);
    await put(["prep", "job", s.jobA.id], "painter", `/api/prep-records?jobId=${s.jobA.id}`);
    // Answers of other screens and another role, with money in them.
    const officeJob = await put(["jobs", "detail", s.jobA.id], "owner", `/api/jobs/${s.jobA.id}`);
    const materials = await put(["materials", "list", {}], "owner", "/api/materials");
    await put(["jobs", "list", { page: 1 }], "owner", "/api/jobs");
    // Guards the guard: the office's answers do carry money keys.
    expect(keyPaths(materials).filter((k) => isMoneyKey(k.key)).length + keyPaths(officeJob).filter((k) => isMoneyKey(k.key)).length).toBeGreaterThan(0);

    const kept = dehydrate(client, { shouldDehydrateQuery: (query) => query.state.status === "success" && keepOnTablet(query.queryKey) });
    expect(kept.queries.map((k) => JSON.stringify(k.queryKey)).sort()).toEqual(
      [["auth", "me"], ["booth", "card", s.jobA.id], ["jobs", "list", BOOTH_JOB_LIST], ["prep", "job", s.jobA.id], ["server-status"]].map((k) => JSON.stringify(k)).sort(),
    );
    const money = kept.queries.flatMap((k) =>
      keyPaths(k.state.data)
        .filter((p) => isMoneyKey(p.key))
        .filter((p) => !listedNotMoney(`/api/jobs ${p.path}`))
        .map((p) => `${JSON.stringify(k.queryKey)} ${p.path}`),
    );
    expect(money).toEqual([]);
    // Nothing of another user: the only user in the kept answers is the painter.
    expect(kept.queries.find((k) => k.queryKey[0] === "auth")!.state.data).toMatchObject({ id: s.painter.id, role: "painter" });
  });
});
