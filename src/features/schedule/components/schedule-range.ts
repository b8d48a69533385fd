/** The span a schedule view shows: one day from 06:00 to 22:00, or a week from Monday, in the browser's clock. */
export type ScheduleSpan = "day" | "week";

const DAY = 86_400_000;
const QUARTER = 15 * 60_000;

export function spanOf(kind: ScheduleSpan, day: Date): { from: number; to: number } {
  const start = new Date(day);
  start.setHours(0, 0, 0, 0);
  if (kind === "day") {
    const from = new Date(start);
    from.setHours(6);
    const to = new Date(start);
    to.setHours(22);
    return { from: from.getTime(), to: to.getTime() };
  }
  const monday = new Date(start);
  monday.setDate(start.getDate() - ((start.getDay() + 6) % 7));
  const next = new Date(monday);
  next.setDate(monday.getDate() + 7);
  return { from: monday.getTime(), to: next.getTime() };
}

export function shiftDay(day: Date, kind: ScheduleSpan, steps: number): Date {
  const d = new Date(day);
  d.setDate(d.getDate() + steps * (kind === "day" ? 1 : 7));
  return d;
}

export const snap = (ms: number) => Math.round(ms / QUARTER) * QUARTER;
export const QUARTER_MS = QUARTER;
export const HOUR_MS = 4 * QUARTER;

/** Hour marks (day view) or midnights (week view) across a span, for the grid and its labels. */
export function marksOf(kind: ScheduleSpan, from: number, to: number): number[] {
  const step = kind === "day" ? HOUR_MS : DAY;
  const out: number[] = [];
  for (let t = from; t < to; t += step) out.push(t);
  return out;
}

const timeFmt = new Intl.DateTimeFormat(undefined, { hour: "2-digit", minute: "2-digit" });
const dayFmt = new Intl.DateTimeFormat(undefined, { weekday: "short", day: "numeric", month: "short" });
export const timeText = (ms: number) => timeFmt.format(ms);
export const dayText = (ms: number) => dayFmt.format(ms);
export const whenText = (ms: number) => `${dayText(ms)} ${timeText(ms)}`;

/** A `datetime-local` input's value for an instant, and back. */
export function toLocalInput(ms: number): string {
  const d = new Date(ms);
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}
export const fromLocalInput = (value: string) => (value ? new Date(value).getTime() : NaN);
