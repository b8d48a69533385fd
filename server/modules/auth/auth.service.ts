import { createHash, randomBytes } from "node:crypto";
import { and, eq, gt, isNull, ne } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { passwordResetTokens, users } from "../../db/schema";
import { getDummyHash, hashPassword, verifyPassword } from "../../auth/password";
import { badRequest, unauthenticated } from "../../http/http-error";
import { sendInBackground } from "../../mail/send-in-background";
import type { SessionUser } from "../../../shared/schemas/auth.schema";

export const RESET_TOKEN_TTL_MS = 60 * 60 * 1000;

const sha256 = (s: string) => createHash("sha256").update(s).digest("hex");

export function toSessionUser(u: typeof users.$inferSelect): SessionUser {
  return { id: u.id, email: u.email, name: u.name, role: u.role, customerId: u.customerId ?? null };
}

export async function signIn(deps: AppDeps, email: string, password: string) {
  const user = deps.db.select().from(users).where(eq(users.email, email)).get();
  if (!user) {
    await verifyPassword(await getDummyHash(), password);
    throw unauthenticated("Email or password is not right");
  }
  const ok = await verifyPassword(user.passwordHash, password);
  if (!ok) throw unauthenticated("Email or password is not right");
  if (!user.active) throw unauthenticated("This account has been switched off. Ask the shop owner.");
  const session = await deps.lucia.createSession(user.id, {});
  return { user: toSessionUser(user), session };
}

/**
 * Always "succeeds" and returns nothing to wait for, so neither the answer nor its timing reveals which e-mails have
 * accounts: the link is stored here and the mail goes out after the answer (sendInBackground). A new link ends every
 * other link of the account.
 */
export function requestPasswordReset(deps: AppDeps, email: string): void {
  const user = deps.db.select().from(users).where(eq(users.email, email)).get();
  if (!user || !user.active) return;
  const token = randomBytes(32).toString("base64url");
  deps.db.transaction((tx) => {
    tx.delete(passwordResetTokens).where(eq(passwordResetTokens.userId, user.id)).run();
    tx.insert(passwordResetTokens)
      .values({ tokenHash: sha256(token), userId: user.id, expiresAt: deps.now() + RESET_TOKEN_TTL_MS })
      .run();
  });
  const link = `${deps.publicUrl}/reset-password?token=${token}`;
  sendInBackground(
    deps.mailer,
    deps.log,
    {
      to: user.email,
      subject: "Reset your Coatwright password",
      text:
        `Hello ${user.name},\n\nSomeone (hopefully you) asked to reset the password for ${user.email}.\n` +
        `Open this link within an hour to choose a new one:\n\n${link}\n\n` +
        `The link works once. If you did not ask, ignore this message; your password stays as it is.\n`,
    },
    "password reset link",
  );
}

const invalidLink = () => badRequest("This reset link is not valid any more. Ask for a new one.", { token: "Expired or already used" });

/**
 * Sets a new password from a reset link. The link is claimed inside the same transaction as the password change
 * (so the same link sent twice at once changes it once), every other link of the account ends with it, every
 * session ends, and the account's sign-in lock is lifted.
 */
export async function confirmPasswordReset(deps: AppDeps, token: string, password: string) {
  const tokenHash = sha256(token);
  const live = () => and(eq(passwordResetTokens.tokenHash, tokenHash), isNull(passwordResetTokens.usedAt), gt(passwordResetTokens.expiresAt, deps.now()));
  const row = deps.db.select().from(passwordResetTokens).where(live()).get();
  if (!row) throw invalidLink();
  const passwordHash = await hashPassword(password);
  const user = deps.db.transaction((tx) => {
    // Claimed here, after the (slow) hashing: a second request with the same link finds it gone.
    if (tx.update(passwordResetTokens).set({ usedAt: deps.now() }).where(live()).run().changes !== 1) throw invalidLink();
    tx.delete(passwordResetTokens).where(and(eq(passwordResetTokens.userId, row.userId), ne(passwordResetTokens.tokenHash, tokenHash))).run();
    tx.update(users).set({ passwordHash, updatedAt: deps.now() }).where(eq(users.id, row.userId)).run();
    return tx.select({ email: users.email }).from(users).where(eq(users.id, row.userId)).get();
  });
  await deps.lucia.invalidateUserSessions(row.userId);
  if (user) await deps.signInLimits.liftAccountLock(user.email);
}

/** Changes the signed-in user's password and ends every session of theirs; the caller then gets a fresh one. */
export async function changePassword(deps: AppDeps, userId: string, currentPassword: string, newPassword: string) {
  const user = deps.db.select().from(users).where(eq(users.id, userId)).get();
  if (!user) throw unauthenticated();
  if (!(await verifyPassword(user.passwordHash, currentPassword)))
    throw badRequest("The current password is not right", { currentPassword: "Not right" });
  const passwordHash = await hashPassword(newPassword);
  deps.db.update(users).set({ passwordHash, updatedAt: deps.now() }).where(eq(users.id, userId)).run();
  await deps.lucia.invalidateUserSessions(userId);
  return deps.lucia.createSession(userId, {});
}
