import { mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";

export type OutboxMessage = {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  attachments: { filename: string; contentType: string; size: number }[];
};

/**
 * A local SMTP server that stands in for the shop's mail relay: it accepts every message and keeps it
 * as JSON (plus the raw attachments) in an outbox folder, which the owner can read in the app in demo mode.
 */
export async function startSmtpOutbox(dir: string, port = 0) {
  mkdirSync(dir, { recursive: true });
  let seq = 0;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const id = `${Date.now().toString(36)}-${(seq++).toString(36)}`;
          const to = session.envelope.rcptTo.map((r) => r.address);
          const message: OutboxMessage = {
            id,
            receivedAt: new Date().toISOString(),
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
            to,
            subject: mail.subject ?? "",
            text: mail.text ?? "",
            html: typeof mail.html === "string" ? mail.html : null,
            attachments: mail.attachments.map((a) => ({ filename: a.filename ?? "attachment", contentType: a.contentType, size: a.size })),
          };
          mail.attachments.forEach((a, i) => writeFileSync(path.join(dir, `${id}.att${i}`), a.content));
          writeFileSync(path.join(dir, `${id}.json`), JSON.stringify(message, null, 2));
          callback();
        })
        .catch(callback);
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  const address = server.server.address() as AddressInfo;
  return {
    port: address.port,
    dir,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** Newest first. */
export function readOutbox(dir: string): OutboxMessage[] {
  let names: string[];
  try {
    names = readdirSync(dir).filter((n) => n.endsWith(".json"));
  } catch {
    return [];
  }
  return names
    .map((n) => JSON.parse(readFileSync(path.join(dir, n), "utf8")) as OutboxMessage)
    .sort((a, b) => (a.receivedAt < b.receivedAt ? 1 : a.receivedAt > b.receivedAt ? -1 : b.id.localeCompare(a.id)));
}

export function readOutboxAttachment(dir: string, id: string, index: number): Buffer | null {
  if (!/^[a-z0-9-]+$/.test(id) || !Number.isInteger(index) || index < 0) return null;
  try {
    return readFileSync(path.join(dir, `${id}.att${index}`));
  } catch {
    return null;
  }
}
