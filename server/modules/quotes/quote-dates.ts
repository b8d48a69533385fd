
/** Quote dates: a calendar day in the shop's time zone (validity, the status a quote shows on a day). */

/** Calendar date (YYYY-MM-DD) in the server's time zone, `addDays` later. */
export function localDate(ms: number, addDays = 0): string {
  const d = new Date(ms);
  d.setDate(d.getDate() + addDays);
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}
