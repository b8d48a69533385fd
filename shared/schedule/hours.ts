import type { BoothHours } from "./types";
import { MINUTE_MS } from "./timing";

const DAY_MS = 86_400_000;
const formats = new Map<string, Intl.DateTimeFormat>();
const WEEKDAYS = ["Sun", "Mon", "Tue", "Wed", "Thu", "Fri", "Sat"];

function formatFor(timeZone: string) {
  let f = formats.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat("en-US", { timeZone, hourCycle: "h23", year: "numeric", month: "numeric", day: "numeric", hour: "numeric", minute: "numeric", second: "numeric", weekday: "short" });
    formats.set(timeZone, f);
  }
  return f;
}

/** The wall clock in a time zone at an instant. */
export function localTime(ms: number, timeZone: string) {
  const parts = Object.fromEntries(formatFor(timeZone).formatToParts(new Date(ms)).map((p) => [p.type, p.value]));
  const year = Number(parts.year), month = Number(parts.month), day = Number(parts.day);
  const minuteOfDay = Number(parts.hour) * 60 + Number(parts.minute);
  const wall = Date.UTC(year, month - 1, day, Number(parts.hour), Number(parts.minute), Number(parts.second));
  return { year, month, day, weekday: WEEKDAYS.indexOf(parts.weekday!), minuteOfDay, offsetMs: wall - (ms - (ms % 1000)) };
}

/** The instant a wall-clock time happens in a time zone (the later one when the clocks go back, as shops read them). */
export function instantOf(year: number, month: number, day: number, minuteOfDay: number, timeZone: string): number {
  const wall = Date.UTC(year, month - 1, day) + minuteOfDay * MINUTE_MS;
  let guess = wall - localTime(wall, timeZone).offsetMs;
  guess = wall - localTime(guess, timeZone).offsetMs;
  return guess;
}

/** The last instant of a calendar date (YYYY-MM-DD) in a time zone: a job due that day may finish until then. */
export function endOfDate(isoDate: string, timeZone: string): number {
  const [y, m, d] = isoDate.split("-").map(Number) as [number, number, number];
  const next = new Date(Date.UTC(y, m - 1, d) + DAY_MS);
  return instantOf(next.getUTCFullYear(), next.getUTCMonth() + 1, next.getUTCDate(), 0, timeZone) - 1;
}

/** Whether spraying from `start` for `minutes` happens on a working day, between opening and closing. */
export function sprayFitsHours(start: number, minutes: number, hours: BoothHours): boolean {
  const t = localTime(start, hours.timeZone);
  return hours.workDays.includes(t.weekday) && t.minuteOfDay >= hours.opensAtMinute && t.minuteOfDay + minutes <= hours.closesAtMinute;
}

/**
 * The earliest instant at or after `from` when spraying for `minutes` fits the booth's hours: `from` itself when it
 * does, else the next working day's opening that leaves room. Null when no day can hold it (longer than a day).
 */
export function nextSprayStart(from: number, minutes: number, hours: BoothHours): number | null {
  if (minutes > hours.closesAtMinute - hours.opensAtMinute || hours.workDays.length === 0) return null;
  if (sprayFitsHours(from, minutes, hours)) return from;
  const t = localTime(from, hours.timeZone);
  for (let ahead = 0; ahead <= 8; ahead++) {
    const date = new Date(Date.UTC(t.year, t.month - 1, t.day) + ahead * DAY_MS);
    const opening = instantOf(date.getUTCFullYear(), date.getUTCMonth() + 1, date.getUTCDate(), hours.opensAtMinute, hours.timeZone);
    if (opening >= from && sprayFitsHours(opening, minutes, hours)) return opening;
  }
  return null;
}
