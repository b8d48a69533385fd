import type { IncomingMessage } from "node:http";

/** Paths (under /api) whose exact request bytes are kept for signature checks. */
const RAW_BODY_PATHS = ["/payments/webhook"];

/**
 * `verify` callback for express.json: keeps the raw bytes of a webhook request on `req.rawBody`, because a
 * provider's signature covers the body exactly as sent, not the parsed-and-reserialised JSON.
 */
export function keepRawBody(req: IncomingMessage, _res: unknown, buf: Buffer) {
  const path = (req.url ?? "").split("?")[0] ?? "";
  if (RAW_BODY_PATHS.includes(path)) (req as IncomingMessage & { rawBody?: Buffer }).rawBody = Buffer.from(buf);
}

export function rawBodyOf(req: IncomingMessage): Buffer | undefined {
  return (req as IncomingMessage & { rawBody?: Buffer }).rawBody;
}
