import { z } from "zod";

/** Positive integer id from a path or body (coerced from strings). */
export const idSchema = z.coerce.number({ error: "Must be a number" }).int("Must be a whole number").positive("Must be a positive id");

export const idParamsSchema = z.object({ id: idSchema });

/** Optional free text: trimmed, empty string becomes null. */
export function optionalText(max: number, label = "Text") {
  return z
    .string()
    .trim()
    .max(max, `${label} is limited to ${max} characters`)
    .transform((v) => (v === "" ? null : v))
    .nullable()
    .optional();
}

export function requiredText(max: number, label: string) {
  return z
    .string({ error: `${label} is required` })
    .trim()
    .min(1, `${label} is required`)
    .max(max, `${label} is limited to ${max} characters`);
}

/** Calendar date as YYYY-MM-DD (a due date has no time of day). */
export const isoDateSchema = z.iso.date({ error: "Use a date like 2026-12-31" });
