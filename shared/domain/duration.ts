/** Minutes as a painter says them: "45 min", "12 h", "1 h 30 min" (a data sheet's 720 min is 12 h). */
export function formatMinutes(minutes: number): string {
  const m = Math.round(minutes);
  if (m < 60) return `${m} min`;
  const h = Math.floor(m / 60);
  const rest = m % 60;
  return rest === 0 ? `${h} h` : `${h} h ${rest} min`;
}
