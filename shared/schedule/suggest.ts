import { nextSprayStart } from "./hours";
import { MINUTE_MS, nextLayerWindow, sessionAt, sprayMinutes } from "./timing";
import type { Booth, ScheduleJob, Session } from "./types";

export type Suggestion = {
  sessions: Session[];
  /** Jobs the suggestion could not place, with the reason in words. */
  unplaced: { jobId: number; reason: string }[];
};

const STEP_MS = 15 * MINUTE_MS;
const roundUp = (t: number) => Math.ceil(t / STEP_MS) * STEP_MS;

/** Keeps each booth's booked time, sorted, to find the first gap a session fits in. */
class BoothBook {
  private readonly busy = new Map<number, Session[]>();
  constructor(sessions: readonly Session[]) {
    for (const s of sessions) this.add(s);
  }
  add(s: Session) {
    const list = this.busy.get(s.boothId) ?? [];
    list.push(s);
    list.sort((a, b) => a.startsAt - b.startsAt);
    this.busy.set(s.boothId, list);
  }
  clash(s: Session): Session | undefined {
    return this.busy.get(s.boothId)?.find((o) => o.startsAt < s.endsAt && s.startsAt < o.endsAt);
  }
}

/** The earliest session for the layer in this booth from `from`: in the booth's hours and in a free gap. */
function earliestIn(book: BoothBook, chain: readonly Session[], booth: Booth, layer: ScheduleJob["layers"][number], from: number, until: number): Session | null {
  const spray = sprayMinutes(booth, layer);
  let t = roundUp(from);
  while (t <= until) {
    const start = nextSprayStart(t, spray, booth);
    if (start == null || start > until) return null;
    const session = sessionAt(booth, layer, start);
    const clash = book.clash(session) ?? chain.find((o) => o.boothId === session.boothId && o.startsAt < session.endsAt && session.startsAt < o.endsAt);
    if (!clash) return session;
    t = roundUp(clash.endsAt);
  }
  return null;
}

/**
 * A proposed booth schedule: jobs by earliest due date (no date last), each job's layers in plan order, each layer in
 * whichever booth can take it first, after prep is signed off, never before the layer under it is dry and never
 * after its recoat window closes. Sessions in `keep` stay as they are. When a layer's window would close before any
 * booth is free, the whole job is tried again from a later start; a job that cannot fit within the horizon, or whose
 * prep sign-off is not planned, is listed as unplaced.
 */
export function suggestSchedule(input: { booths: readonly Booth[]; jobs: readonly ScheduleJob[]; keep?: readonly Session[]; from: number; horizonDays?: number }): Suggestion {
  const book = new BoothBook(input.keep ?? []);
  const horizon = input.from + (input.horizonDays ?? 28) * 86_400_000;
  const sessions: Session[] = [];
  const unplaced: Suggestion["unplaced"] = [];
  const order = [...input.jobs].sort((a, b) => (a.dueDate ?? "9999").localeCompare(b.dueDate ?? "9999") || a.id - b.id);

  for (const job of order) {
    if (job.layers.length === 0) continue;
    if (input.booths.length === 0) {
      unplaced.push({ jobId: job.id, reason: "There is no booth to book" });
      continue;
    }
    if (job.prepReadyAt == null) {
      unplaced.push({ jobId: job.id, reason: "Plan when prep will be signed off first" });
      continue;
    }
    let start = roundUp(Math.max(input.from, job.prepReadyAt));
    let placed: Session[] | null = null;
    while (!placed && start <= horizon) {
      const chain: Session[] = [];
      let from = start;
      let until = horizon;
      let retryFrom: number | null = null;
      for (const layer of job.layers) {
        const options = input.booths.map((b) => earliestIn(book, chain, b, layer, from, until)).filter((s): s is Session => s != null);
        const best = options.sort((a, b) => a.startsAt - b.startsAt)[0];
        if (!best) {
          // The window closed before a booth was free: start the whole job later.
          retryFrom = start + STEP_MS * 4;
          break;
        }
        chain.push(best);
        const booth = input.booths.find((b) => b.id === best.boothId)!;
        const window = nextLayerWindow(best, booth, layer);
        from = window.opensAt;
        until = Math.min(horizon, window.closesAt ?? horizon);
      }
      if (retryFrom == null) placed = chain;
      else start = retryFrom;
    }
    if (!placed) {
      unplaced.push({ jobId: job.id, reason: "No booth time fits its layers and their recoat windows in the next weeks" });
      continue;
    }
    for (const s of placed) {
      book.add(s);
      sessions.push(s);
    }
  }
  return { sessions, unplaced };
}
