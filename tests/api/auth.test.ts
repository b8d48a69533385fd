import { describe, expect, it } from "vitest";
import request from "supertest";
import { addUser, makeApp, TEST_PASSWORD } from "../support/test-app";
import { ARGON2_PARAMS } from "../../server/auth/password";
import { users } from "../../server/db/schema";
import { eq } from "drizzle-orm";

const cookieOf = (res: request.Response) => {
  const raw = res.headers["set-cookie"] as unknown as string[] | undefined;
  return raw?.find((c) => c.startsWith("cw_session="));
};

async function signIn(app: ReturnType<typeof makeApp>["app"], email: string, password = TEST_PASSWORD, headers: Record<string, string> = {}) {
  return request(app).post("/api/auth/sign-in").set(headers).send({ email, password });
}

describe("sign-in and sessions", () => {
  it("signs in with the right password and sets an HttpOnly, SameSite=Lax session cookie without Secure over http", async () => {
    const t = makeApp();
    const u = await addUser(t, "estimator", { email: "est@shop.test", name: "Eve Stim" });
    const res = await signIn(t.app, "EST@shop.test ");
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: u.id, email: "est@shop.test", name: "Eve Stim", role: "estimator", customerId: null });
    const cookie = cookieOf(res)!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
    const me = await request(t.app).get("/api/auth/me").set("Cookie", cookie.split(";")[0]!);
    expect(me.status).toBe(200);
    expect(me.body.role).toBe("estimator");
  });

  it("marks the cookie Secure when served over https behind a trusted proxy", async () => {
    const t = makeApp({ trustProxy: true });
    await addUser(t, "owner", { email: "own@shop.test" });
    const res = await signIn(t.app, "own@shop.test", TEST_PASSWORD, { "X-Forwarded-Proto": "https" });
    expect(res.status).toBe(200);
    expect(cookieOf(res)).toMatch(/Secure/);
  });

  it("refuses a wrong password or unknown e-mail with the same 401 message", async () => {
    const t = makeApp();
    await addUser(t, "owner", { email: "own@shop.test" });
    const wrong = await signIn(t.app, "own@shop.test", "not-it-at-all");
    const unknown = await signIn(t.app, "who@shop.test", "not-it-at-all");
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
    expect(cookieOf(wrong)).toBeUndefined();
  });

  it("answers a malformed sign-in body with 400 naming the fields", async () => {
    const t = makeApp();
    const res = await request(t.app).post("/api/auth/sign-in").send({ email: "not-an-email" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({ email: expect.any(String), password: expect.any(String) });
    const bad = await request(t.app).post("/api/auth/sign-in").set("Content-Type", "application/json").send("{not json");
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe("bad_request");
  });

  it("sign-out ends the session on the server, so the old cookie no longer works", async () => {
    const t = makeApp();
    await addUser(t, "painter", { email: "pa@shop.test" });
    const cookie = cookieOf(await signIn(t.app, "pa@shop.test"))!.split(";")[0]!;
    expect((await request(t.app).get("/api/auth/me").set("Cookie", cookie)).status).toBe(200);
    const out = await request(t.app).post("/api/auth/sign-out").set("Cookie", cookie);
    expect(out.status).toBe(204);
    expect(cookieOf(out)).toMatch(/cw_session=;/);
    expect((await request(t.app).get("/api/auth/me").set("Cookie", cookie)).status).toBe(401);
  });

  it("a switched-off account cannot sign in and its sessions end", async () => {
    const t = makeApp();
    const u = await addUser(t, "painter", { email: "gone@shop.test" });
    const cookie = cookieOf(await signIn(t.app, "gone@shop.test"))!.split(";")[0]!;
    t.db.update(users).set({ active: false }).where(eq(users.id, u.id)).run();
    expect((await request(t.app).get("/api/auth/me").set("Cookie", cookie)).status).toBe(401);
    const again = await signIn(t.app, "gone@shop.test");
    expect(again.status).toBe(401);
    expect(again.body.error.message).toMatch(/switched off/);
  });

  it("hashes passwords with argon2id at or above OWASP's minimum (19 MiB, t=2, p=1)", async () => {
    // OWASP Password Storage Cheat Sheet: argon2id, m=19456 KiB, t=2, p=1 as the minimum configuration.
    expect(ARGON2_PARAMS.memoryCost).toBeGreaterThanOrEqual(19456);
    expect(ARGON2_PARAMS.timeCost).toBeGreaterThanOrEqual(2);
    const t = makeApp();
    const u = await addUser(t, "owner");
    const row = t.db.select().from(users).where(eq(users.id, u.id)).get()!;
    expect(row.passwordHash).toMatch(/^\$argon2id\$v=19\$m=(\d+),t=(\d+),p=1\$/);
    const [, m, tc] = row.passwordHash.match(/m=(\d+),t=(\d+)/)!;
    expect(Number(m)).toBeGreaterThanOrEqual(19456);
    expect(Number(tc)).toBeGreaterThanOrEqual(2);
  });
});

describe("sign-in rate limits", () => {
  it("locks an account after repeated failures, with a clear message, while other accounts still sign in", async () => {
    const t = makeApp({ rateLimits: { signIn: { perAddress: 100, perAccount: 3, windowMs: 60_000 } } });
    await addUser(t, "owner", { email: "target@shop.test" });
    await addUser(t, "estimator", { email: "other@shop.test" });
    for (let i = 0; i < 3; i++) expect((await signIn(t.app, "target@shop.test", "guess-" + i)).status).toBe(401);
    const locked = await signIn(t.app, "target@shop.test");
    expect(locked.status).toBe(429);
    expect(locked.body.error).toMatchObject({ code: "rate_limited", message: expect.stringMatching(/too many failed sign-ins for this account/i) });
    expect(locked.headers["ratelimit"]).toBeDefined();
    expect((await signIn(t.app, "other@shop.test")).status).toBe(200);
  });

  it("limits attempts per address across accounts", async () => {
    const t = makeApp({ rateLimits: { signIn: { perAddress: 4, perAccount: 100, windowMs: 60_000 } } });
    for (let i = 0; i < 4; i++) expect((await signIn(t.app, `u${i}@shop.test`, "whatever-pass")).status).toBe(401);
    const res = await signIn(t.app, "u9@shop.test", "whatever-pass");
    expect(res.status).toBe(429);
    expect(res.body.error.message).toMatch(/from this address/);
  });
});

describe("cross-site requests", () => {
  it("refuses a state-changing request from a foreign Origin with 403, and accepts the same origin", async () => {
    const t = makeApp();
    await addUser(t, "owner", { email: "own@shop.test" });
    const foreign = await request(t.app)
      .post("/api/auth/sign-in")
      .set("Origin", "https://evil.example")
      .send({ email: "own@shop.test", password: TEST_PASSWORD });
    expect(foreign.status).toBe(403);
    expect(foreign.body.error.code).toBe("forbidden");
    const same = await request(t.app).post("/api/auth/sign-in").set("Host", "shop.test").set("Origin", "http://shop.test").send({ email: "own@shop.test", password: TEST_PASSWORD });
    expect(same.status).toBe(200);
  });

  it("lets reads through whatever the Origin", async () => {
    const t = makeApp();
    const res = await request(t.app).get("/api/health").set("Origin", "https://evil.example");
    expect(res.status).toBe(200);
  });
});

describe("password reset and change", () => {
  it("e-mails a one-time link; the token sets a new password once and ends old sessions", async () => {
    const t = makeApp();
    await addUser(t, "estimator", { email: "forgot@shop.test" });
    const oldCookie = cookieOf(await signIn(t.app, "forgot@shop.test"))!.split(";")[0]!;

    const ask = await request(t.app).post("/api/auth/password-reset").send({ email: "forgot@shop.test" });
    expect(ask.status).toBe(202);
    await expect.poll(() => t.sent).toHaveLength(1);
    expect(t.sent[0]!.to).toBe("forgot@shop.test");
    const token = t.sent[0]!.text.match(/reset-password\?token=([\w-]+)/)![1]!;
    expect(t.sent[0]!.text).toContain("http://coatwright.test/reset-password?token=");

    const ok = await request(t.app).post("/api/auth/password-reset/confirm").send({ token, password: "brand-new-password" });
    expect(ok.status).toBe(200);
    expect((await request(t.app).get("/api/auth/me").set("Cookie", oldCookie)).status).toBe(401);
    expect((await signIn(t.app, "forgot@shop.test")).status).toBe(401);
    expect((await signIn(t.app, "forgot@shop.test", "brand-new-password")).status).toBe(200);

    const reuse = await request(t.app).post("/api/auth/password-reset/confirm").send({ token, password: "another-new-password" });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error.fields).toHaveProperty("token");
  });

  it("gives the same answer for an unknown e-mail and sends nothing", async () => {
    const t = makeApp();
    const res = await request(t.app).post("/api/auth/password-reset").send({ email: "nobody@shop.test" });
    expect(res.status).toBe(202);
    await new Promise((r) => setTimeout(r, 50)); // the mail, had there been one, goes out just after the answer
    expect(t.sent).toHaveLength(0);
  });

  it("refuses an expired token", async () => {
    let clock = Date.parse("2026-12-01T10:00:00Z");
    const t = makeApp({ now: () => clock });
    await addUser(t, "painter", { email: "late@shop.test" });
    await request(t.app).post("/api/auth/password-reset").send({ email: "late@shop.test" });
    await expect.poll(() => t.sent).toHaveLength(1);
    const token = t.sent[0]!.text.match(/token=([\w-]+)/)![1]!;
    clock += 61 * 60_000;
    const res = await request(t.app).post("/api/auth/password-reset/confirm").send({ token, password: "brand-new-password" });
    expect(res.status).toBe(400);
  });

  it("rejects a short new password naming the field", async () => {
    const t = makeApp();
    const res = await request(t.app).post("/api/auth/password-reset/confirm").send({ token: "y".repeat(43), password: "short" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/at least 10/);
  });

  it("changing the password ends every other session and keeps this one signed in", async () => {
    const t = makeApp();
    await addUser(t, "owner", { email: "chg@shop.test" });
    const laptop = cookieOf(await signIn(t.app, "chg@shop.test"))!.split(";")[0]!;
    const tablet = cookieOf(await signIn(t.app, "chg@shop.test"))!.split(";")[0]!;
    const res = await request(t.app).post("/api/auth/password").set("Cookie", laptop).send({ currentPassword: TEST_PASSWORD, newPassword: "a-fresh-password" });
    expect(res.status).toBe(200);
    const fresh = cookieOf(res)!.split(";")[0]!;
    expect((await request(t.app).get("/api/auth/me").set("Cookie", tablet)).status).toBe(401);
    expect((await request(t.app).get("/api/auth/me").set("Cookie", laptop)).status).toBe(401);
    expect((await request(t.app).get("/api/auth/me").set("Cookie", fresh)).status).toBe(200);
  });
});
