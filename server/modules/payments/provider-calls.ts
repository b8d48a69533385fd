import type { AppDeps } from "../../deps";
import { HttpError } from "../../http/http-error";
import type { Logger } from "../../log/logger";

export function requirePayments(deps: AppDeps) {
  if (!deps.payments) throw new HttpError(503, "upstream_failed", "Online card payments are not set up for this shop. Please contact the shop to pay the deposit.");
  return deps.payments;
}

/** The status the provider answered a refused call with (4xx), or undefined when it did not answer. */
export const providerStatus = (err: unknown) => {
  const status = (err as { statusCode?: unknown })?.statusCode;
  return typeof status === "number" ? status : undefined;
};

export function upstream(log: Logger, err: unknown, doing: string): never {
  const message = err instanceof Error ? err.message : String(err);
  // The provider answered and refused the request (e.g. a refund larger than what it still holds): a conflict
  // the shop can act on, not an outage. Anything else (unreachable, 5xx) is a bad gateway.
  const status = providerStatus(err);
  if (status !== undefined && status >= 400 && status < 500) throw new HttpError(409, "conflict", `The payment provider refused to ${doing}: ${message}`);
  log.error({ err: { message } }, `payments: ${doing} failed`);
  throw new HttpError(502, "upstream_failed", `The payment provider could not ${doing}: ${message}`);
}
