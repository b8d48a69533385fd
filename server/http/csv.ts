import { stringify } from "csv-stringify/sync";

/**
 * Every CSV the product writes goes through here. A cell that begins with = + - @ tab or carriage return is
 * written with a leading apostrophe (csv-stringify's `escape_formulas`), so a spreadsheet shows it as text instead of
 * running it as a formula (a job title `=HYPERLINK(…)` once went raw into the VOC log). Numbers, negative ones
 * included, are written as numbers.
 */
export function toCsv(rows: unknown[][]): string {
  return stringify(rows, { escape_formulas: true });
}
