import { pino, type DestinationStream, type Logger, type LevelWithSilent } from "pino";

export type { Logger };

/**
 * Keys that may hold a secret, censored wherever they turn up in a logged object. Request lines never carry
 * headers or bodies in the first place (see http/request-log.ts); this is the second line of defence for
 * anything logged by hand.
 */
const SECRET_KEYS = ["password", "newPassword", "currentPassword", "token", "cookie", "authorization", "secret", "signature", "card", "cardNumber", "cvc"];
const SECRET_PATHS = [...SECRET_KEYS, ...SECRET_KEYS.map((k) => `*.${k}`), 'headers["set-cookie"]', 'headers["x-portal-token"]', 'headers["stripe-signature"]'];

/**
 * The server's one logger: a JSON line per event on stdout (or `destination`), written synchronously so the last
 * lines before an exit are not lost. `npm run dev` pipes it through pino-pretty for people to read.
 */
export function createLogger(options: { level?: LevelWithSilent; destination?: DestinationStream } = {}): Logger {
  return pino(
    {
      level: options.level ?? "info",
      base: { app: "coatwright" },
      redact: { paths: SECRET_PATHS, censor: "[redacted]" },
    },
    options.destination ?? pino.destination({ dest: 1, sync: true }),
  );
}

/** For apps built in tests and tools that log nothing. */
export const silentLogger: Logger = pino({ level: "silent" });
