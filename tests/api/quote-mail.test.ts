import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import request from "supertest";
import { createSmtpMailer } from "../../server/mail/mailer";
import { startSmtpOutbox } from "../../server/stand-ins/smtp-outbox";
import { makeShop } from "../support/test-app";
import { draftQuote } from "../support/quotes";
import { binary, pdfText } from "../support/pdf-text";

describe("a quote e-mail through the SMTP stand-in", () => {
  let outbox: Awaited<ReturnType<typeof startSmtpOutbox>>;
  beforeAll(async () => {
    outbox = await startSmtpOutbox(mkdtempSync(path.join(tmpdir(), "cw-quote-outbox-")));
  });
  afterAll(() => outbox.close());

  it("arrives with the PDF attached and a working portal link; the owner reads it in the outbox", async () => {
    const mailer = createSmtpMailer({ host: "127.0.0.1", port: outbox.port, from: "Harrow Creek <shop@coatwright.test>" });
    const s = await makeShop({ mailer, demoMode: true, outboxDir: outbox.dir });
    const q = await draftQuote(s);
    const sent = await s.as("estimator").post(`/api/quotes/${q.id}/send`).send({});
    expect(sent.status).toBe(200);

    const list = await s.as("owner").get("/api/outbox");
    const mail = list.body.items.find((m: { to: string[]; subject: string }) => m.to.includes("avery.stone@example.test") && m.subject.includes("Helmet in candy teal"));
    expect(mail).toBeDefined();
    expect(mail.attachments).toEqual([{ filename: `quote-${q.id}-v1.pdf`, contentType: "application/pdf", size: expect.any(Number) }]);
    expect(mail.html).toContain("Read and approve the quote");

    // The attachment is the quote: a PDF with the totals in it.
    const file = await s
      .as("owner")
      .get(`/api/outbox/${mail.id}/attachments/0`)
      .buffer(true)
      .parse(binary);
    expect(file.status).toBe(200);
    const text = (await pdfText(file.body as Buffer)).replace(/\s+/g, "");
    expect(text).toContain("Total$1,310.36");
    expect(text).toContain("$524.14");

    // The link in the text opens the quote in the portal without signing in.
    const link = /http:\/\/coatwright\.test(\/portal\/link\/(\S+))/.exec(mail.text);
    expect(link).not.toBeNull();
    const token = link![2]!;
    const portal = await request(s.app).get(`/api/portal/quotes/${q.id}`).set("X-Portal-Token", token);
    expect(portal.status).toBe(200);
    expect(portal.body).toMatchObject({ id: q.id, totalCents: 131036, depositCents: 52414, status: "viewed" });

    // Logged on the job.
    const log = await s.as("estimator").get(`/api/messages?jobId=${s.jobA.id}`);
    expect(log.body.items[0]).toMatchObject({ kind: "quote", status: "sent" });
  });

  it("a dead SMTP server: 502 with a clear message, and the quote stays a draft", async () => {
    const mailer = createSmtpMailer({ host: "127.0.0.1", port: 1, from: "shop@coatwright.test" });
    const s = await makeShop({ mailer });
    const q = await draftQuote(s);
    const res = await s.as("estimator").post(`/api/quotes/${q.id}/send`).send({});
    expect(res.status).toBe(502);
    expect(res.body.error.code).toBe("upstream_failed");
    expect((await s.as("estimator").get(`/api/quotes/${q.id}`)).body.status).toBe("draft");
  });
});
