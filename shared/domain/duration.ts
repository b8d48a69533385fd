/** Minutes as a painter says them: "45 min", "0.5 min", "12 h", "1 h 30 min" (a data sheet's 720 min is 12 h). */
export function formatMinutes(minutes: number): string {
  if (minutes < 60) return `${Math.round(minutes * 10) / 10} min`;
  const h = Math.floor(minutes / 60);
  const m = Math.round(minutes % 60);
  return m === 60 ? `${h + 1} h` : m ? `${h} h ${m} min` : `${h} h`;
}
