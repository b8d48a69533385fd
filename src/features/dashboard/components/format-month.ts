const monthFormat = new Intl.DateTimeFormat(undefined, { month: "short", year: "2-digit" });
const longMonthFormat = new Intl.DateTimeFormat(undefined, { month: "long", year: "numeric" });

function parseMonth(value: string): Date | null {
  const m = /^(\d{4})-(\d{2})$/.exec(value);
  return m ? new Date(Number(m[1]), Number(m[2]) - 1, 1) : null;
}

/** "2026-03" → "Mar 26", for chart axes. */
export function formatMonthShort(value: string): string {
  const d = parseMonth(value);
  return d ? monthFormat.format(d) : value;
}

/** "2026-03" → "March 2026", for tables. */
export function formatMonthLong(value: string): string {
  const d = parseMonth(value);
  return d ? longMonthFormat.format(d) : value;
}
