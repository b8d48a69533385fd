import nodemailer from "nodemailer";
import { HttpError } from "../http/http-error";
import { silentLogger, type Logger } from "../log/logger";

export type MailMessage = {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: { filename: string; content: Buffer; contentType?: string }[];
};

export type Mailer = { send(message: MailMessage): Promise<{ messageId: string }> };

export type SmtpSettings = { host: string; port: number; secure?: boolean; user?: string; pass?: string; from: string };

/** Sends through any SMTP server: a real relay in production, the local outbox stand-in in the demo and tests. */
export function createSmtpMailer(settings: SmtpSettings, log: Logger = silentLogger): Mailer {
  const transport = nodemailer.createTransport({
    host: settings.host,
    port: settings.port,
    secure: settings.secure ?? false,
    ignoreTLS: !settings.secure && !settings.user,
    auth: settings.user ? { user: settings.user, pass: settings.pass ?? "" } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
  });
  return {
    async send(message) {
      try {
        const info = await transport.sendMail({ from: settings.from, ...message });
        return { messageId: String(info.messageId) };
      } catch (err) {
        log.error({ err: { message: (err as Error).message, code: (err as { code?: unknown }).code } }, "mail: sending failed");
        throw new HttpError(502, "upstream_failed", "The mail server could not be reached, so nothing was sent. Try again in a moment.");
      }
    },
  };
}
