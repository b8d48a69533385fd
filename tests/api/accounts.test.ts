import { describe, expect, it } from "vitest";
import request from "supertest";
import { addUser, makeApp, TEST_PASSWORD } from "../support/test-app";
import type { MailMessage, Mailer } from "../../server/mail/mailer";
import { requestPasswordReset } from "../../server/modules/auth/auth.service";

/*
 * Accounts: the password reset answers alike whether or not the address has an account, a reset link ends every
 * other link of its account, a completed reset lifts the account's sign-in lock, and the per-address sign-in limit
 * counts failures only.
 */

const signIn = (app: ReturnType<typeof makeApp>["app"], email: string, password = TEST_PASSWORD) =>
  request(app).post("/api/auth/sign-in").send({ email, password });
const askReset = (app: ReturnType<typeof makeApp>["app"], email: string) => request(app).post("/api/auth/password-reset").send({ email });
const confirm = (app: ReturnType<typeof makeApp>["app"], token: string, password: string) =>
  request(app).post("/api/auth/password-reset/confirm").send({ token, password });
const tokenIn = (m: MailMessage) => /reset-password\?token=([\w-]+)/.exec(m.text)![1]!;

/** A mailer that keeps each message and finishes sending only when `release` is called (or never). */
function slowMailer(delayMs: number | null) {
  const sent: MailMessage[] = [];
  const delivered: MailMessage[] = [];
  const mailer: Mailer = {
    send(m) {
      sent.push(m);
      if (delayMs === null) return new Promise(() => undefined);
      return new Promise((resolve) =>
        setTimeout(() => {
          delivered.push(m);
          resolve({ messageId: `slow-${sent.length}` });
        }, delayMs),
      );
    },
  };
  return { mailer, sent, delivered };
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
};

describe("password reset answers alike for known and unknown addresses", () => {
  it("does not wait for the mail: with a mail relay that never answers, a known address still gets the same 202 at once", async () => {
    const mail = slowMailer(null);
    const t = makeApp({ mailer: mail.mailer });
    await addUser(t, "estimator", { email: "known@shop.test" });
    const known = await askReset(t.app, "known@shop.test").timeout(3000);
    const unknown = await askReset(t.app, "nobody@shop.test").timeout(3000);
    expect(known.status).toBe(202);
    expect([unknown.status, unknown.body]).toEqual([known.status, known.body]);
    // The mail was handed over (it is on its way), just not waited for.
    await expect.poll(() => mail.sent.map((m) => m.to)).toEqual(["known@shop.test"]);
  });

  it("by structure: the reset request returns nothing to wait for, and the mail is handed over only after the answer", async () => {
    const mail = slowMailer(null);
    const t = makeApp({ mailer: mail.mailer });
    await addUser(t, "owner", { email: "known@shop.test" });
    // Not a promise: the request handler has nothing it could await.
    expect(requestPasswordReset(t.app.deps, "known@shop.test")).toBeUndefined();
    expect(requestPasswordReset(t.app.deps, "nobody@shop.test")).toBeUndefined();
    // Nothing reached the mailer while the caller was still running (so nothing of it is on the request path) …
    expect(mail.sent).toHaveLength(0);
    // … and it goes out right after.
    await expect.poll(() => mail.sent.map((m) => m.to)).toEqual(["known@shop.test"]);
  });

  it("measured: with a mail relay taking 400 ms, known and unknown addresses answer within the same few milliseconds, and the mail still goes out", async () => {
    const DELAY = 400;
    const mail = slowMailer(DELAY);
    const t = makeApp({ mailer: mail.mailer, rateLimits: { passwordReset: 100 } });
    await addUser(t, "owner", { email: "known@shop.test" });
    const known: number[] = [];
    const unknown: number[] = [];
    // Interleaved, so a slow moment of the machine falls on both sides alike.
    for (let i = 0; i < 8; i++) {
      for (const [email, times] of [
        ["known@shop.test", known],
        [`nobody${i}@shop.test`, unknown],
      ] as const) {
        const start = performance.now();
        const res = await askReset(t.app, email);
        times.push(performance.now() - start);
        expect(res.status).toBe(202);
      }
    }
    // Before the fix the known address answered only once the mail was sent (≥ 400 ms every time), so its median
    // was at least DELAY above the unknown one's. The bound is half the relay's delay: far above any noise here.
    expect(median(known) - median(unknown)).toBeLessThan(DELAY / 2);
    expect(median(known)).toBeLessThan(DELAY);
    await expect.poll(() => mail.delivered.length, { timeout: 5000 }).toBe(8);
  });
});

describe("reset links", () => {
  it("issuing a new link ends the older one; using the newer one, the older still fails", async () => {
    const t = makeApp();
    await addUser(t, "estimator", { email: "twice@shop.test" });
    expect((await askReset(t.app, "twice@shop.test")).status).toBe(202);
    expect((await askReset(t.app, "twice@shop.test")).status).toBe(202);
    await expect.poll(() => t.sent.length).toBe(2);
    const [older, newer] = t.sent.map(tokenIn) as [string, string];
    expect(older).not.toBe(newer);

    expect((await confirm(t.app, newer, "the-newer-password")).status).toBe(200);
    const late = await confirm(t.app, older, "the-older-password");
    expect(late.status).toBe(400);
    expect(late.body.error.fields).toHaveProperty("token");
    expect((await signIn(t.app, "twice@shop.test", "the-older-password")).status).toBe(401);
    expect((await signIn(t.app, "twice@shop.test", "the-newer-password")).status).toBe(200);
  });

  it("an older link fails as soon as a newer one is issued, before the newer is used", async () => {
    const t = makeApp();
    await addUser(t, "painter", { email: "again@shop.test" });
    await askReset(t.app, "again@shop.test");
    await askReset(t.app, "again@shop.test");
    await expect.poll(() => t.sent.length).toBe(2);
    expect((await confirm(t.app, tokenIn(t.sent[0]!), "the-older-password")).status).toBe(400);
    expect((await signIn(t.app, "again@shop.test")).status).toBe(200);
  });

  it("the same link sent twice at once changes the password once", async () => {
    const t = makeApp();
    await addUser(t, "owner", { email: "race@shop.test" });
    await askReset(t.app, "race@shop.test");
    await expect.poll(() => t.sent.length).toBe(1);
    const token = tokenIn(t.sent[0]!);
    const [a, b] = await Promise.all([confirm(t.app, token, "first-new-password"), confirm(t.app, token, "second-new-password")]);
    expect([a.status, b.status].sort()).toEqual([200, 400]);
    const winner = a.status === 200 ? "first-new-password" : "second-new-password";
    const loser = a.status === 200 ? "second-new-password" : "first-new-password";
    expect((await signIn(t.app, "race@shop.test", winner)).status).toBe(200);
    expect((await signIn(t.app, "race@shop.test", loser)).status).toBe(401);
  });
});

describe("sign-in limits", () => {
  it("eight wrong passwords lock the account (429 says a reset lifts it), and a completed reset lifts the lock", async () => {
    // The shop's defaults: 8 failed sign-ins per account per 15 minutes.
    const t = makeApp();
    await addUser(t, "estimator", { email: "locked@shop.test" });
    for (let i = 0; i < 8; i++) expect((await signIn(t.app, "locked@shop.test", `wrong-guess-${i}`)).status).toBe(401);
    const locked = await signIn(t.app, "locked@shop.test");
    expect(locked.status).toBe(429);
    expect(locked.body.error.message).toMatch(/reset the password/);

    await askReset(t.app, "locked@shop.test");
    await expect.poll(() => t.sent.length).toBe(1);
    expect((await confirm(t.app, tokenIn(t.sent[0]!), "a-brand-new-password")).status).toBe(200);
    expect((await signIn(t.app, "locked@shop.test", "a-brand-new-password")).status).toBe(200);
  });

  it("a reset only asked for (not completed) leaves the lock in place", async () => {
    const t = makeApp({ rateLimits: { signIn: { perAddress: 100, perAccount: 3, windowMs: 60_000 } } });
    await addUser(t, "estimator", { email: "still@shop.test" });
    for (let i = 0; i < 3; i++) await signIn(t.app, "still@shop.test", `wrong-guess-${i}`);
    await askReset(t.app, "still@shop.test");
    expect((await signIn(t.app, "still@shop.test")).status).toBe(429);
  });

  it("the per-address limit counts failures only: 35 good sign-ins from one address in a row all get in", async () => {
    // The shop's defaults: 30 attempts per address per 15 minutes.
    const t = makeApp();
    const people = await Promise.all(["a", "b", "c", "d", "e"].map((n) => addUser(t, "painter", { email: `${n}@shop.test` })));
    const statuses: number[] = [];
    for (let i = 0; i < 35; i++) statuses.push((await signIn(t.app, people[i % people.length]!.email)).status);
    expect(statuses).toEqual(Array(35).fill(200));
  });

  it("failures from one address are still limited, whatever good sign-ins come between them", async () => {
    const t = makeApp({ rateLimits: { signIn: { perAddress: 5, perAccount: 100, windowMs: 60_000 } } });
    await addUser(t, "owner", { email: "good@shop.test" });
    for (let i = 0; i < 4; i++) expect((await signIn(t.app, `u${i}@shop.test`, "whatever-pass")).status).toBe(401);
    for (let i = 0; i < 10; i++) expect((await signIn(t.app, "good@shop.test")).status).toBe(200);
    expect((await signIn(t.app, "u5@shop.test", "whatever-pass")).status).toBe(401);
    const blocked = await signIn(t.app, "u6@shop.test", "whatever-pass");
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toMatch(/from this address/);
  });
});
