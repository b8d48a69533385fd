import { z } from "zod";
import { ROLES } from "../domain/roles";

export const PASSWORD_MIN_LENGTH = 10;

export const emailSchema = z
  .string({ error: "Email is required" })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: "Enter a valid email address" }).max(254, "Email is too long"));

export const signInInputSchema = z.object({
  email: emailSchema,
  password: z.string({ error: "Password is required" }).min(1, "Password is required").max(200, "Password is too long"),
});
export type SignInInput = z.infer<typeof signInInputSchema>;

export const newPasswordSchema = z
  .string({ error: "Password is required" })
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(200, "Password is too long");

export const passwordResetRequestSchema = z.object({ email: emailSchema });
export type PasswordResetRequest = z.infer<typeof passwordResetRequestSchema>;

export const passwordResetConfirmSchema = z.object({
  token: z.string({ error: "Reset token is required" }).min(20, "Reset token is not valid").max(200, "Reset token is not valid"),
  password: newPasswordSchema,
});
export type PasswordResetConfirm = z.infer<typeof passwordResetConfirmSchema>;

export const changePasswordSchema = z.object({
  currentPassword: z.string({ error: "Current password is required" }).min(1, "Current password is required"),
  newPassword: newPasswordSchema,
});
export type ChangePasswordInput = z.infer<typeof changePasswordSchema>;

export const sessionUserSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  customerId: z.number().nullable(),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;
