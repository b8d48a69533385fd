import { createHash, randomBytes } from "node:crypto";
import { and, eq, gt, isNull } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { passwordResetTokens, users } from "../../db/schema";
import { getDummyHash, hashPassword, verifyPassword } from "../../auth/password";
import { badRequest, unauthenticated } from "../../http/http-error";
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

/** Always succeeds from the caller's point of view, so the answer does not reveal which e-mails have accounts. */
export async function requestPasswordReset(deps: AppDeps, email: string) {
  const user = deps.db.select().from(users).where(eq(users.email, email)).get();
  if (!user || !user.active) return;
  const token = randomBytes(32).toString("base64url");
  deps.db
    .insert(passwordResetTokens)
    .values({ tokenHash: sha256(token), userId: user.id, expiresAt: deps.now() + RESET_TOKEN_TTL_MS })
    .run();
  const link = `${deps.publicUrl}/reset-password?token=${token}`;
  await deps.mailer.send({
    to: user.email,
    subject: "Reset your Coatwright password",
    text:
      `Hello ${user.name},\n\nSomeone (hopefully you) asked to reset the password for ${user.email}.\n` +
      `Open this link within an hour to choose a new one:\n\n${link}\n\n` +
      `The link works once. If you did not ask, ignore this message; your password stays as it is.\n`,
  });
}

export async function confirmPasswordReset(deps: AppDeps, token: string, password: string) {
  const row = deps.db
    .select()
    .from(passwordResetTokens)
    .where(
      and(eq(passwordResetTokens.tokenHash, sha256(token)), isNull(passwordResetTokens.usedAt), gt(passwordResetTokens.expiresAt, deps.now())),
    )
    .get();
  if (!row) throw badRequest("This reset link is not valid any more. Ask for a new one.", { token: "Expired or already used" });
  const passwordHash = await hashPassword(password);
  deps.db.transaction((tx) => {
    tx.update(passwordResetTokens).set({ usedAt: deps.now() }).where(eq(passwordResetTokens.tokenHash, row.tokenHash)).run();
    tx.update(users).set({ passwordHash, updatedAt: deps.now() }).where(eq(users.id, row.userId)).run();
  });
  await deps.lucia.invalidateUserSessions(row.userId);
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
