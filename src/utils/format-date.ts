/** Parses YYYY-MM-DD as a local date (no time-zone shift). */
function parseDateOnly(value: string): Date | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(value);
  if (!m) return null;
  return new Date(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
}

const dateFormat = new Intl.DateTimeFormat(undefined, { day: "numeric", month: "short", year: "numeric" });
const shortDateFormat = new Intl.DateTimeFormat(undefined, { weekday: "short", day: "numeric", month: "short" });
const dateTimeFormat = new Intl.DateTimeFormat(undefined, {
  day: "numeric",
  month: "short",
  year: "numeric",
  hour: "numeric",
  minute: "2-digit",
});

/** "12 Mar 2027" for a YYYY-MM-DD due date. */
export function formatDate(value: string | null | undefined): string {
  if (!value) return "";
  const d = parseDateOnly(value);
  return d ? dateFormat.format(d) : value;
}

/** "Fri 12 Mar" — compact, for cards. Adds the year when it is not this year. */
export function formatShortDate(value: string | null | undefined): string {
  if (!value) return "";
  const d = parseDateOnly(value);
  if (!d) return value;
  return d.getFullYear() === new Date().getFullYear() ? shortDateFormat.format(d) : dateFormat.format(d);
}

/** Date and time for an ISO timestamp. */
export function formatDateTime(value: string | null | undefined): string {
  if (!value) return "";
  const d = new Date(value);
  return Number.isNaN(d.getTime()) ? value : dateTimeFormat.format(d);
}

const dayOfTimestampFormat = new Intl.DateTimeFormat(undefined, { day: "numeric", month: "short", year: "numeric" });

/** Just the date of an ISO timestamp: "1 Dec 2026". */
export function formatDay(value: string | null | undefined): string {
  if (!value) return "";
  const d = new Date(value);
  return Number.isNaN(d.getTime()) ? value : dayOfTimestampFormat.format(d);
}

/** Whole days from today to a YYYY-MM-DD date (negative when past). */
export function daysFromToday(value: string, now = new Date()): number | null {
  const d = parseDateOnly(value);
  if (!d) return null;
  const today = new Date(now.getFullYear(), now.getMonth(), now.getDate());
  return Math.round((d.getTime() - today.getTime()) / 86_400_000);
}
