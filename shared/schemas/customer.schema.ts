import { z } from "zod";
import { optionalText, requiredText, versionSchema } from "./common.schema";
import { pageQuerySchema, sortSchema } from "../api/pagination";

export const customerFieldsSchema = z.object({
  name: requiredText(120, "Name"),
  email: z
    .string()
    .trim()
    .toLowerCase()
    .max(254, "Email is too long")
    .transform((v) => (v === "" ? null : v))
    .pipe(z.email({ error: "Enter a valid email address" }).nullable())
    .nullable()
    .optional(),
  phone: optionalText(40, "Phone"),
  address: optionalText(300, "Address"),
  notes: optionalText(2000, "Notes"),
});

export const createCustomerInputSchema = customerFieldsSchema;
export type CreateCustomerInput = z.input<typeof createCustomerInputSchema>;

export const updateCustomerInputSchema = customerFieldsSchema.partial().extend({ version: versionSchema });
export type UpdateCustomerInput = z.input<typeof updateCustomerInputSchema>;

export const listCustomersQuerySchema = pageQuerySchema.extend({
  sort: sortSchema(["name", "email", "createdAt", "jobCount"] as const, "name"),
});
export type ListCustomersQuery = z.infer<typeof listCustomersQuerySchema>;

export type CustomerDto = {
  /** The edit version: goes up with every change; an edit sends the one it read. */
  version: number;
  id: number;
  name: string;
  email: string | null;
  phone: string | null;
  address: string | null;
  notes: string | null;
  jobCount: number;
  createdAt: string;
  updatedAt: string;
};
