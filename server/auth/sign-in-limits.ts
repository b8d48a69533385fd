import { rateLimit, type RateLimitRequestHandler } from "express-rate-limit";
import type { Request } from "express";

export type SignInLimitsConfig = { perAddress: number; perAccount: number; windowMs: number };

const tooMany = (message: string) => (_req: Request, res: import("express").Response) => {
  res.status(429).json({ error: { code: "rate_limited", message } });
};

/** The key of an account's counter: the e-mail as the sign-in form sends it, trimmed and lower-cased. */
export const accountKey = (email: unknown) => `acct:${String(email ?? "").trim().toLowerCase()}`;

/**
 * Sign-in limits, both counting failed sign-ins only (a good sign-in is taken back off the count):
 *  - per address: many failures from one address, across accounts (guessing many accounts);
 *  - per account: failures for one account from anywhere (guessing one password); a completed password reset
 *    lifts it (`liftAccountLock`), as the 429 says.
 * In memory, per process (see the README on growing past one machine).
 */
export function createSignInLimits({ perAddress, perAccount, windowMs }: SignInLimitsConfig) {
  const minutes = Math.round(windowMs / 60_000);
  const common = { windowMs, standardHeaders: "draft-8" as const, legacyHeaders: false, skipSuccessfulRequests: true };
  const byAddress: RateLimitRequestHandler = rateLimit({
    ...common,
    limit: perAddress,
    handler: tooMany(`Too many failed sign-ins from this address. Wait ${minutes} minutes and try again.`),
  });
  const byAccount: RateLimitRequestHandler = rateLimit({
    ...common,
    limit: perAccount,
    keyGenerator: (req) => accountKey((req.body as { email?: unknown } | undefined)?.email),
    handler: tooMany(`Too many failed sign-ins for this account. Wait ${minutes} minutes or reset the password.`),
  });
  return {
    byAddress,
    byAccount,
    /** Clears an account's failed sign-ins (after its password was reset). */
    liftAccountLock: (email: string) => byAccount.resetKey(accountKey(email)),
  };
}

export type SignInLimits = ReturnType<typeof createSignInLimits>;
