/** The request header that makes a write safe to send again (the booth tablet's offline queue sends one per entry). */
export const IDEMPOTENCY_HEADER = "Idempotency-Key";
/** Keys are the client's own random ids (a UUID); anything from 8 to 128 visible characters is accepted. */
export const IDEMPOTENCY_KEY_PATTERN = /^[A-Za-z0-9_\-:.]{8,128}$/;
/** How long a key is remembered. */
export const IDEMPOTENCY_KEEP_DAYS = 30;
