import { beforeAll, describe, expect, it } from "vitest";
import { keyPaths, makeDemoShop, type DemoShop, type DemoWho } from "../../support/demo-shop";
import { fillPath, idPools, paramSets, type IdPools } from "./id-pools";
import { isMoneyKey, listedNotMoney } from "./money-keys";
import type { RouteInfo } from "../../../server/http/route-list";

/**
 * A painter sees no money. On the full demo shop the painter calls every read route open to them, with the
 * ids of their own jobs and everything on them, and every JSON answer is walked for keys naming price, cost,
 * total, amount, rate or cents. The few keys below carry those words but hold counts or measured volumes; each
 * is listed in money-keys.ts with what it is, so a new key with a money word fails until someone looks at it.
 */
let s: DemoShop;
let mine: IdPools;

beforeAll(async () => {
  s = await makeDemoShop();
  const jobIds = s.rows<{ id: number }>("select id from jobs where assigned_painter_id = ? order by id", s.accounts.painter.id).map((r) => r.id);
  mine = idPools(s, jobIds);
}, 60_000);

/** Query strings for read routes without an id in the path, pointed at the painter's records. */
function queryFor(path: string): string {
  const job = mine.single.jobs![0];
  if (path === "/api/panels/compare") return `?ids=${mine.single.panels!.slice(0, 2).join(",")}`;
  if (path === "/api/panels/ladder") {
    // Any ground/candy pair the panel library holds (the ladder is shop-wide, not per job).
    const p = s.rows<{ g: string; c: string }>("select ground_name g, candy_name c from test_panels limit 1")[0]!;
    return `?ground=${encodeURIComponent(p.g)}&candy=${encodeURIComponent(p.c)}`;
  }
  return `?jobId=${job}`;
}

/** Walks every read answer `who` gets on `pools`; returns money-word key paths (route + path) and how many 200s. */
async function walk(who: DemoWho, pools: IdPools) {
  const found = new Set<string>();
  let ok = 0;
  const reads = (s.app.routes as RouteInfo[]).filter((r) => r.method === "GET" && ["public", "signedIn", "staff"].includes(r.access!) && !r.path.startsWith("/api/portal"));
  for (const r of reads) {
    for (const p of paramSets(r.path, pools)) {
      const res = await s.call(who, "GET", r.path.includes(":") ? fillPath(r.path, p) : `${r.path}${queryFor(r.path)}`);
      if (res.status === 200) ok++;
      if (!String(res.headers["content-type"]).includes("json")) continue;
      for (const k of keyPaths(res.body)) if (isMoneyKey(k.key)) found.add(`${r.path} ${k.path}`);
    }
  }
  return { found: [...found], ok, reads };
}

describe("a painter sees no money", () => {
  it("no read answer the painter gets has a price, cost, total, amount, rate or cents key (besides listed counts and volumes)", async () => {
    const { found, ok, reads } = await walk("painter", mine);
    const money = found.filter((f) => !listedNotMoney(f));
    expect(money).toEqual([]);
    // The walk really read the painter's screens' data: most routes answered 200 with real records.
    expect(ok).toBeGreaterThan(reads.length);
  });

  it("the same walk as the owner does find the money (so the walker sees it when it is there)", async () => {
    const { found } = await walk("owner", mine);
    const money = found.filter((f) => !listedNotMoney(f));
    expect(money.length).toBeGreaterThan(3);
    expect(money.some((m) => /cost/i.test(m))).toBe(true);
    // Change orders carry their price difference for the office; the painter's walk above reads the same routes.
    expect(money).toEqual(expect.arrayContaining(["/api/change-orders/:id .money.depositCents", "/api/change-orders/:id .money.lines[].rateCents"]));
    expect(mine.single["change-orders"]!.length).toBeGreaterThan(0);
  });
});
