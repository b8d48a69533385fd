import { z } from "zod";

export const MAX_PAGE_SIZE = 100;

/** Common list query: 1-based page, page size, "field" or "-field" sort, free-text search. */
export const pageQuerySchema = z.object({
  page: z.coerce.number().int().min(1, "Page starts at 1").default(1),
  pageSize: z.coerce.number().int().min(1).max(MAX_PAGE_SIZE, `At most ${MAX_PAGE_SIZE} rows a page`).default(25),
  q: z.string().trim().max(200, "Search text is too long").optional(),
});

export function sortSchema<const T extends readonly [string, ...string[]]>(fields: T, fallback: T[number] | `-${T[number]}`) {
  const allowed = [...fields, ...fields.map((f) => `-${f}`)] as [string, ...string[]];
  return z
    .enum(allowed, { error: `Sort by one of: ${fields.join(", ")} (prefix "-" for descending)` })
    .default(fallback) as z.ZodDefault<z.ZodType<T[number] | `-${T[number]}`>>;
}

export type Page<T> = { items: T[]; total: number; page: number; pageSize: number };

export function parseSort(sort: string): { field: string; desc: boolean } {
  return sort.startsWith("-") ? { field: sort.slice(1), desc: true } : { field: sort, desc: false };
}
