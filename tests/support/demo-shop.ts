import request from "supertest";
import { eq } from "drizzle-orm";
import { users } from "../../server/db/schema";
import { seedDemo } from "../../server/db/seed/index";
import { cookieFor, makeApp } from "./test-app";

export type DemoWho = "anonymous" | "owner" | "estimator" | "painter" | "customer";

/**
 * The full demo shop (every kind of record, many customers) on an in-memory database, with a session cookie
 * for each demo account. Payments point at a closed local port: access checks run before any provider call.
 */
export async function makeDemoShop() {
  const t = makeApp({ demoMode: true, payments: { secretKey: "sk_test_local", webhookSecret: "whsec_local", host: "127.0.0.1", port: 9, protocol: "http" } });
  await seedDemo(t.db, Date.now(), { uploadsDir: t.app.deps.uploadsDir });
  const user = (role: Exclude<DemoWho, "anonymous">) => t.db.select().from(users).where(eq(users.email, `${role}@demo.coatwright.test`)).get()!;
  const accounts = { owner: user("owner"), estimator: user("estimator"), painter: user("painter"), customer: user("customer") };
  const cookies = {
    owner: await cookieFor(t, accounts.owner.id),
    estimator: await cookieFor(t, accounts.estimator.id),
    painter: await cookieFor(t, accounts.painter.id),
    customer: await cookieFor(t, accounts.customer.id),
  };
  /** All rows of a query on the raw SQLite handle (the sweeps pick ids across many tables). */
  const rows = <T>(sql: string, ...args: unknown[]) => t.db.$client.prepare(sql).all(...args) as T[];
  return {
    ...t,
    accounts,
    cookies,
    rows,
    /** A supertest request as a demo account (or anonymous), optionally with extra headers. */
    call(who: DemoWho, method: string, url: string, headers: Record<string, string> = {}) {
      const m = method.toLowerCase() as "get" | "post" | "patch" | "put" | "delete";
      let r = request(t.app)[m](url);
      if (who !== "anonymous") r = r.set("Cookie", cookies[who]);
      for (const [k, v] of Object.entries(headers)) r = r.set(k, v);
      return r;
    },
  };
}
export type DemoShop = Awaited<ReturnType<typeof makeDemoShop>>;

/** Every key path in a JSON value, e.g. "items[].layers[].costCents", paired with its key. */
export function keyPaths(value: unknown, at = ""): { path: string; key: string }[] {
  if (Array.isArray(value)) return value.flatMap((v) => keyPaths(v, `${at}[]`));
  if (value && typeof value === "object")
    return Object.entries(value).flatMap(([k, v]) => [{ path: `${at}.${k}`, key: k }, ...keyPaths(v, `${at}.${k}`)]);
  return [];
}
