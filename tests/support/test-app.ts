import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import request from "supertest";
import { randomUUID } from "node:crypto";
import { createApp, type CreateAppOptions } from "../../server/app";
import { migrateDb, openDb } from "../../server/db/client";
import { customers, jobItems, jobStageEvents, jobs, users } from "../../server/db/schema";
import { hashPassword } from "../../server/auth/password";
import type { MailMessage, Mailer } from "../../server/mail/mailer";
import type { Role } from "../../shared/domain/roles";
import type { Stage } from "../../shared/domain/stages";

export const TEST_PASSWORD = "correct-horse-battery";
let cachedHash: Promise<string> | undefined;
const passwordHash = () => (cachedHash ??= hashPassword(TEST_PASSWORD));

/** A mailer that keeps what it would have sent. */
export function memoryMailer() {
  const sent: MailMessage[] = [];
  const mailer: Mailer = {
    async send(m) {
      sent.push(m);
      return { messageId: `test-${sent.length}` };
    },
  };
  return { mailer, sent };
}

/** The migrated empty schema, made once per test file and copied for each app (cheaper than migrating each time). */
let migrated: Buffer | undefined;
function freshDb() {
  if (!migrated) {
    const db = openDb(":memory:");
    migrateDb(db);
    migrated = db.$client.serialize();
    db.$client.close();
  }
  return openDb(migrated);
}

/** The migrated empty schema written to a file and opened from there (WAL, as the server runs it). */
function freshFileDb(file: string) {
  freshDb().$client.close();
  writeFileSync(file, migrated!);
  return openDb(file);
}

export type MakeAppOptions = Partial<CreateAppOptions> & {
  /** Keep the database in this file instead of in memory (for tests that reopen it, or fill its disk). */
  dbFile?: string;
};

/** A fresh app on a fresh migrated SQLite database (in memory unless `dbFile` is given). */
export function makeApp({ dbFile, ...options }: MakeAppOptions = {}) {
  const db = dbFile ? freshFileDb(dbFile) : freshDb();
  const mail = memoryMailer();
  const app = createApp({
    db,
    mailer: mail.mailer,
    publicUrl: "http://coatwright.test",
    dataDir: mkdtempSync(path.join(tmpdir(), "cw-test-")),
    ...options,
  });
  return { app, db, sent: mail.sent };
}

export type TestApp = ReturnType<typeof makeApp>;

/** Inserts a user directly (fast: the password hash is computed once per test run). */
export async function addUser(t: TestApp, role: Role, extra: { email?: string; name?: string; customerId?: number | null; active?: boolean } = {}) {
  const id = randomUUID();
  const email = extra.email ?? `${role}-${id.slice(0, 8)}@shop.test`;
  t.db
    .insert(users)
    .values({ id, email, name: extra.name ?? `Test ${role}`, role, customerId: extra.customerId ?? null, active: extra.active ?? true, passwordHash: await passwordHash() })
    .run();
  return { id, email, role };
}

/** A session cookie for a user without going through sign-in (no argon2 cost). */
export async function cookieFor(t: TestApp, userId: string) {
  const session = await t.app.deps.lucia.createSession(userId, {});
  const c = t.app.deps.lucia.createSessionCookie(session.id);
  return `${c.name}=${c.value}`;
}

export function addCustomer(t: TestApp, name = "Test Customer") {
  return t.db.insert(customers).values({ name, email: `${name.toLowerCase().replace(/\W+/g, ".")}@example.test` }).returning().get();
}

export function addJob(t: TestApp, customerId: number, extra: { title?: string; stage?: Stage; painterId?: string | null; dueDate?: string | null; notes?: string | null } = {}) {
  const job = t.db
    .insert(jobs)
    .values({
      customerId,
      title: extra.title ?? "Tank and fenders",
      stage: extra.stage ?? "inquiry",
      assignedPainterId: extra.painterId ?? null,
      dueDate: extra.dueDate ?? null,
      notes: extra.notes ?? null,
    })
    .returning()
    .get();
  t.db.insert(jobStageEvents).values({ jobId: job.id, fromStage: null, toStage: job.stage, at: Date.now() }).run();
  return job;
}

export function addItem(t: TestApp, jobId: number, name = "Fuel tank") {
  return t.db.insert(jobItems).values({ jobId, name, substrate: "steel", surfaceArea: 0.6, areaUnit: "m2" }).returning().get();
}

/**
 * A small shop: two customers with a job each, one user per role (the customer user linked to customer A),
 * a second painter, and signed-in cookies for every role.
 */
export async function makeShop(options: MakeAppOptions = {}) {
  const t = makeApp(options);
  const customerA = addCustomer(t, "Avery Stone");
  const customerB = addCustomer(t, "Blake Moor");
  const spareCustomer = addCustomer(t, "Casey Nobody");
  const owner = await addUser(t, "owner");
  const estimator = await addUser(t, "estimator");
  const painter = await addUser(t, "painter");
  const painter2 = await addUser(t, "painter");
  const customer = await addUser(t, "customer", { customerId: customerA.id, email: "avery@example.test" });
  const customerBUser = await addUser(t, "customer", { customerId: customerB.id, email: "blake@example.test" });
  const jobA = addJob(t, customerA.id, { title: "Helmet in candy teal", stage: "in_prep", painterId: painter.id, notes: "Internal: watch the vent holes" });
  const jobB = addJob(t, customerB.id, { title: "Guitar body in sunburst", stage: "in_prep", painterId: painter2.id });
  const inquiryA = addJob(t, customerA.id, { title: "Golf cart roof", stage: "inquiry", painterId: painter.id });
  const itemA = addItem(t, jobA.id, "Helmet shell");
  const itemB = addItem(t, jobB.id, "Guitar body");
  const cookies = {
    owner: await cookieFor(t, owner.id),
    estimator: await cookieFor(t, estimator.id),
    painter: await cookieFor(t, painter.id),
    customer: await cookieFor(t, customer.id),
  };
  return {
    ...t,
    customerA,
    customerB,
    spareCustomer,
    owner,
    estimator,
    painter,
    painter2,
    customer,
    customerBUser,
    jobA,
    jobB,
    inquiryA,
    itemA,
    itemB,
    cookies,
    /** supertest request as a role (or anonymous). */
    as(role: keyof typeof cookies | "anonymous") {
      const agent = request(t.app);
      const cookie = role === "anonymous" ? undefined : cookies[role];
      const wrap = (m: "get" | "post" | "patch" | "put" | "delete") => (url: string) => {
        const r = agent[m](url);
        return cookie ? r.set("Cookie", cookie) : r;
      };
      return { get: wrap("get"), post: wrap("post"), patch: wrap("patch"), put: wrap("put"), delete: wrap("delete") };
    },
  };
}
export type Shop = Awaited<ReturnType<typeof makeShop>>;

/**
 * An edit as a screen makes it: read the record's current `version` (from `read`, the record's own address unless
 * given; `pick` finds the record in the answer), then PATCH (or PUT) the changes with that version.
 */
export async function editAt(
  shop: Shop,
  who: Parameters<Shop["as"]>[0],
  path: string,
  changes: object,
  options: { read?: string; pick?: (body: Record<string, unknown>) => { version: number; editVersion?: number }; method?: "patch" | "put" } = {},
) {
  const res = await shop.as(who).get(options.read ?? path);
  const record = (options.pick ? options.pick(res.body) : res.body) as { version: number; editVersion?: number };
  // A quote's own `version` is its version number; its edit version is `editVersion`.
  const token = typeof record.editVersion === "number" ? { editVersion: record.editVersion } : { version: record.version };
  return shop.as(who)[options.method ?? "patch"](path).send({ ...changes, ...token });
}
