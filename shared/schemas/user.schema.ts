import { z } from "zod";
import { ROLES } from "../domain/roles";
import { emailSchema, newPasswordSchema } from "./auth.schema";
import { idSchema, requiredText, versionSchema } from "./common.schema";
import { pageQuerySchema, sortSchema } from "../api/pagination";

const roleSchema = z.enum(ROLES, { error: `Role must be one of: ${ROLES.join(", ")}` });

export const createUserInputSchema = z
  .object({
    email: emailSchema,
    name: requiredText(120, "Name"),
    role: roleSchema,
    password: newPasswordSchema,
    customerId: idSchema.nullable().optional(),
  })
  .refine((u) => u.role !== "customer" || u.customerId != null, {
    path: ["customerId"],
    message: "A customer account must be linked to a customer record",
  });
export type CreateUserInput = z.infer<typeof createUserInputSchema>;

export const updateUserInputSchema = z
  .object({
    name: requiredText(120, "Name"),
    role: roleSchema,
    active: z.boolean({ error: "Active must be true or false" }),
    customerId: idSchema.nullable(),
  })
  .partial()
  .extend({ version: versionSchema });
export type UpdateUserInput = z.infer<typeof updateUserInputSchema>;

export const listUsersQuerySchema = pageQuerySchema.extend({
  role: roleSchema.optional(),
  sort: sortSchema(["name", "email", "role", "createdAt"] as const, "name"),
});
export type ListUsersQuery = z.infer<typeof listUsersQuerySchema>;

export type UserDto = {
  /** The edit version: goes up with every change; an edit sends the one it read. */
  version: number;
  id: string;
  email: string;
  name: string;
  role: (typeof ROLES)[number];
  active: boolean;
  customerId: number | null;
  customerName: string | null;
  createdAt: string;
  updatedAt: string;
};

export type PainterDto = { id: string; name: string };
