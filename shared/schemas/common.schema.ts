import { z } from "zod";

/**
 * A whole number sent as text (an address, a query string, a form field) is read only when it is plain decimal
 * digits: "0x10", "1e1", " 16" or "016" stay text and fail the number check, where `Number()` would read them as 16
 * or 10 and reach another record.
 */
export const fromDigits = (v: unknown) => (typeof v === "string" && /^(0|[1-9][0-9]{0,15})$/.test(v) ? Number(v) : v);

/** Positive integer id from a path, query, form field (decimal digits only) or JSON body (a number). */
export const idSchema = z.preprocess(
  fromDigits,
  z.number({ error: "Must be a number (digits only)" }).int("Must be a whole number").positive("Must be a positive id").max(Number.MAX_SAFE_INTEGER, "Must be a valid id"),
);

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

type Patched<T extends z.ZodRawShape> = { [K in keyof T]: z.ZodOptional<T[K] extends z.ZodDefault<infer Inner> ? Inner : T[K]> };

/**
 * The PATCH form of an object schema: every field optional, and no field's `.default()` filled in. (`.partial()`
 * alone still applies defaults, so a PATCH that sent one field reset every defaulted field it left out.)
 */
export function patchSchemaOf<T extends z.ZodRawShape>(schema: z.ZodObject<T>): z.ZodObject<Patched<T>> {
  const shape = Object.fromEntries(Object.entries(schema.shape).map(([key, field]) => [key, ((field instanceof z.ZodDefault ? field.removeDefault() : field) as z.ZodType).optional()]));
  return z.object(shape) as unknown as z.ZodObject<Patched<T>>;
}

/** The version of a record an edit was made from (PUT and PATCH send it; a stale one is refused with 409). */
export const versionSchema = z.preprocess(
  fromDigits,
  z.number({ error: "Send the version of the record you are changing (version)" }).int("Version is a whole number").positive("Version is a positive number"),
);

/**
 * When an entry was made on the tablet, for one sent late (the booth's offline queue). The server keeps it within
 * bounds: not in the future, not before the job (or the batch) it belongs to.
 */
export const madeAtSchema = z.iso.datetime({ error: "Use a date and time like 2026-12-31T10:15:00Z", offset: true }).optional();
