import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import request from "supertest";
import { createLogger } from "../../server/log/logger";
import { createSmtpMailer } from "../../server/mail/mailer";
import { startSmtpOutbox } from "../../server/stand-ins/smtp-outbox";
import { addUser, cookieFor, makeApp } from "../support/test-app";

describe("e-mail through the local SMTP stand-in", () => {
  let outbox: Awaited<ReturnType<typeof startSmtpOutbox>>;
  beforeAll(async () => {
    outbox = await startSmtpOutbox(mkdtempSync(path.join(tmpdir(), "cw-outbox-")));
  });
  afterAll(() => outbox.close());

  it("a password reset travels over SMTP and the owner reads it in the outbox (demo mode)", async () => {
    const mailer = createSmtpMailer({ host: "127.0.0.1", port: outbox.port, from: "Coatwright <no-reply@coatwright.test>" });
    const t = makeApp({ mailer, demoMode: true, outboxDir: outbox.dir });
    const owner = await addUser(t, "owner", { email: "boss@shop.test" });
    await addUser(t, "painter", { email: "forgetful@shop.test" });
    expect((await request(t.app).post("/api/auth/password-reset").send({ email: "forgetful@shop.test" })).status).toBe(202);

    // The mail goes out after the answer: read the outbox until it is there.
    const cookie = await cookieFor(t, owner.id);
    const inOutbox = async () => {
      const res = await request(t.app).get("/api/outbox").set("Cookie", cookie);
      expect(res.status).toBe(200);
      return res.body.items.find((m: { to: string[] }) => m.to.includes("forgetful@shop.test"));
    };
    await expect.poll(inOutbox, { timeout: 5000 }).toBeDefined();
    const mail = await inOutbox();
    expect(mail).toMatchObject({ subject: "Reset your Coatwright password", from: "no-reply@coatwright.test" });
    expect(mail.text).toMatch(/http:\/\/coatwright\.test\/reset-password\?token=[\w-]{40,}/);
  });

  it("keeps attachments, readable through the outbox", async () => {
    const mailer = createSmtpMailer({ host: "127.0.0.1", port: outbox.port, from: "shop@coatwright.test" });
    await mailer.send({ to: "x@example.test", subject: "With file", text: "see file", attachments: [{ filename: "note.txt", content: Buffer.from("hello panel"), contentType: "text/plain" }] });
    const t = makeApp({ mailer, demoMode: true, outboxDir: outbox.dir });
    const owner = await addUser(t, "owner");
    const cookie = await cookieFor(t, owner.id);
    const list = await request(t.app).get("/api/outbox").set("Cookie", cookie);
    const mail = list.body.items.find((m: { subject: string }) => m.subject === "With file");
    expect(mail.attachments).toEqual([{ filename: "note.txt", contentType: "text/plain", size: 11 }]);
    const file = await request(t.app).get(`/api/outbox/${mail.id}/attachments/0`).set("Cookie", cookie);
    expect(file.status).toBe(200);
    expect(file.text).toBe("hello panel");
  });

  it("hides the outbox outside demo mode", async () => {
    const t = makeApp({ demoMode: false, outboxDir: outbox.dir });
    const owner = await addUser(t, "owner");
    const res = await request(t.app).get("/api/outbox").set("Cookie", await cookieFor(t, owner.id));
    expect(res.status).toBe(404);
  });

  it("a dead SMTP server: the reset request still answers as for an unknown address (no hang, no tell), and the failure is logged", async () => {
    const mailer = createSmtpMailer({ host: "127.0.0.1", port: 1, from: "shop@coatwright.test" });
    const raw: string[] = [];
    const logger = createLogger({ level: "info", destination: { write: (line: string) => void raw.push(line) } });
    const t = makeApp({ mailer, logger });
    await addUser(t, "painter", { email: "p@shop.test" });
    const known = await request(t.app).post("/api/auth/password-reset").send({ email: "p@shop.test" });
    const unknown = await request(t.app).post("/api/auth/password-reset").send({ email: "nobody@shop.test" });
    expect(known.status).toBe(202);
    expect([unknown.status, unknown.body]).toEqual([known.status, known.body]);
    const failures = () => raw.map((l) => JSON.parse(l) as { level: number; msg: string }).filter((l) => l.msg.includes("password reset link was not sent"));
    await expect.poll(() => failures().length, { timeout: 5000 }).toBe(1);
    expect(failures()[0]!.level).toBe(50); // pino's "error" level
  });
});
