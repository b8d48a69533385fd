import type { MailMessage, Mailer } from "./mailer";
import type { Logger } from "../log/logger";

/**
 * Hands a message to the mailer after the current request has been answered, without waiting for the relay:
 * an answer must not take longer (or fail) because mail was sent, or reveal by its timing that it was.
 * A failure is logged; the caller has nothing to undo.
 */
export function sendInBackground(mailer: Mailer, log: Logger, message: MailMessage, what: string): void {
  setImmediate(() => {
    mailer.send(message).catch((err: unknown) => log.error({ err: { message: err instanceof Error ? err.message : String(err) } }, `mail: ${what} was not sent`));
  });
}
