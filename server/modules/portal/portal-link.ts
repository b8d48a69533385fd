import { createHmac, timingSafeEqual } from "node:crypto";

/**
 * Signed, expiring links to one quote in the customer portal, sent in the quote e-mail.
 * Token: `<quoteId>.<expires, unix seconds>.<HMAC-SHA256(secret, "quote-link:<quoteId>:<expires>"), base64url>`.
 * Nothing is stored: the signature proves the server made the link, the expiry is inside what is signed.
 */
const sign = (secret: string, quoteId: number, expSec: number) =>
  createHmac("sha256", secret).update(`quote-link:${quoteId}:${expSec}`).digest("base64url");

export function signQuoteLink(secret: string, quoteId: number, expiresAtMs: number): string {
  const exp = Math.floor(expiresAtMs / 1000);
  return `${quoteId}.${exp}.${sign(secret, quoteId, exp)}`;
}

export type QuoteLinkClaims = { quoteId: number; expiresAt: number };

/** The claims of a valid, unexpired token; null for anything else (malformed, altered, expired). */
export function verifyQuoteLink(secret: string, token: string, now: number): QuoteLinkClaims | null {
  if (typeof token !== "string" || token.length > 200) return null;
  const m = /^(\d{1,12})\.(\d{1,12})\.([A-Za-z0-9_-]{43})$/.exec(token);
  if (!m) return null;
  const quoteId = Number(m[1]);
  const exp = Number(m[2]);
  const expected = Buffer.from(sign(secret, quoteId, exp));
  const given = Buffer.from(m[3]!);
  if (expected.length !== given.length || !timingSafeEqual(expected, given)) return null;
  if (exp * 1000 <= now) return null;
  return { quoteId, expiresAt: exp * 1000 };
}

/** How long a link in a quote e-mail works: until the quote's valid-until date plus two weeks, at least 14 days. */
export function linkExpiry(now: number, validUntil: string): number {
  const endOfValid = Date.parse(`${validUntil}T23:59:59Z`);
  const fortnight = 14 * 86_400_000;
  return Math.max(now + fortnight, (Number.isFinite(endOfValid) ? endOfValid : now) + fortnight);
}

export const portalLinkPath = (token: string) => `/portal/link/${token}`;
