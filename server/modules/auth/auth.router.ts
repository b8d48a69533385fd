import { Router } from "express";
import { rateLimit } from "express-rate-limit";
import type { AppDeps } from "../../deps";
import { allow, actorOf } from "../../http/guard";
import { body } from "../../http/validate";
import { writeCookie } from "../../auth/session";
import {
  changePasswordSchema,
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
  signInInputSchema,
} from "../../../shared/schemas/auth.schema";
import { changePassword, confirmPasswordReset, requestPasswordReset, signIn } from "./auth.service";

export function authRouter(deps: AppDeps) {
  const r = Router();
  const { byAddress: signInByAddress, byAccount: signInByAccount } = deps.signInLimits;
  const resetLimiter = rateLimit({
    windowMs: deps.rateLimits.signIn.windowMs,
    limit: deps.rateLimits.passwordReset,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: "rate_limited", message: "Too many reset requests. Wait a while and try again." } });
    },
  });

  r.post("/sign-in", allow("public"), signInByAddress, signInByAccount, async (req, res) => {
    const input = body(req, signInInputSchema);
    const { user, session } = await signIn(deps, input.email, input.password);
    writeCookie(req, res, deps.lucia.createSessionCookie(session.id));
    res.json(user);
  });

  r.post("/sign-out", allow("public"), async (req, res) => {
    if (res.locals.sessionId) await deps.lucia.invalidateSession(res.locals.sessionId);
    writeCookie(req, res, deps.lucia.createBlankSessionCookie());
    res.status(204).end();
  });

  r.get("/me", allow("signedIn"), (_req, res) => {
    res.json(actorOf(res));
  });

  r.post("/password-reset", allow("public"), resetLimiter, async (req, res) => {
    const input = body(req, passwordResetRequestSchema);
    // Answers at once, alike for every address: the mail (if any) goes out after the answer.
    requestPasswordReset(deps, input.email);
    res.status(202).json({ message: "If that address has an account, a reset link is on its way." });
  });

  r.post("/password-reset/confirm", allow("public"), resetLimiter, async (req, res) => {
    const input = body(req, passwordResetConfirmSchema);
    await confirmPasswordReset(deps, input.token, input.password);
    res.json({ message: "Password changed. Sign in with the new one." });
  });

  r.post("/password", allow("signedIn"), async (req, res) => {
    const input = body(req, changePasswordSchema);
    const session = await changePassword(deps, actorOf(res).id, input.currentPassword, input.newPassword);
    writeCookie(req, res, deps.lucia.createSessionCookie(session.id));
    res.json({ message: "Password changed. Other devices have been signed out." });
  });

  return r;
}
