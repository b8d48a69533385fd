import { useEffect, useState } from "react";

/**
 * The server's "now", ticking every `intervalMs`. The offset between the server clock (sent with the card) and
 * this device is measured when the card arrives, so a tablet with a wrong clock still counts down correctly.
 * Nothing here is kept beyond the page: timers are always recomputed from stored times.
 */
export function useServerNow(serverNowIso: string, receivedAt: number, intervalMs = 1000): number {
  const offset = Date.parse(serverNowIso) - receivedAt;
  const [local, setLocal] = useState(() => Date.now());
  useEffect(() => {
    const id = window.setInterval(() => setLocal(Date.now()), intervalMs);
    return () => window.clearInterval(id);
  }, [intervalMs]);
  return local + offset;
}

/** "4:05", "1:02:09"; negative durations are shown as their size. */
export function formatCountdown(ms: number): string {
  const total = Math.floor(Math.abs(ms) / 1000);
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  const pad = (n: number) => String(n).padStart(2, "0");
  return h > 0 ? `${h}:${pad(m)}:${pad(s)}` : `${m}:${pad(s)}`;
}

/** "12 min", "1 h 5 min" for a plain duration in minutes. */

/** How long ago, for people: "45 s", "12 min", "3 h 5 min", "4 days". */
export function formatAgo(ms: number): string {
  const s = Math.abs(ms) / 1000;
  if (s < 60) return `${Math.floor(s)} s`;
  const min = s / 60;
  if (min < 60) return `${Math.floor(min)} min`;
  const h = min / 60;
  if (h < 24) return `${Math.floor(h)} h ${Math.floor(min % 60)} min`;
  const days = Math.floor(h / 24);
  return `${days} ${days === 1 ? "day" : "days"}`;
}
