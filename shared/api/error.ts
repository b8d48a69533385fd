import { z } from "zod";

/**
 * Every failed API response has this body. `fields` maps a field path ("email", "items.0.name") to a message;
 * `requestId` is the id of the request in the server's log (also sent as X-Request-Id), for a user to quote.
 */
export const apiErrorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
    requestId: z.string().optional(),
    /** With `version_conflict`: the record as it is now, and who saved it when. */
    current: z.unknown().optional(),
    changedBy: z.string().nullable().optional(),
    changedAt: z.string().nullable().optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>;

export const ERROR_CODES = [
  "bad_request",
  "validation_failed",
  "unauthenticated",
  "forbidden",
  "not_found",
  "conflict",
  "idempotency_key_reused",
  "version_conflict",
  "payload_too_large",
  "unsupported_media_type",
  "rate_limited",
  "upstream_failed",
  "storage_full",
  "internal",
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];
