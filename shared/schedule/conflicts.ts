import { endOfDate, sprayFitsHours } from "./hours";
import { nextLayerWindow, sprayMinutes } from "./timing";
import type { Booth, Conflict, ScheduleJob, ScheduleLayer, Session } from "./types";

export type ScheduleFacts = { booths: readonly Booth[]; jobs: readonly ScheduleJob[] };

const clock = (ms: number, timeZone: string) =>
  new Intl.DateTimeFormat("en-GB", { timeZone, weekday: "short", day: "numeric", month: "short", hour: "2-digit", minute: "2-digit" }).format(ms);

/**
 * Everything wrong with a set of booth sessions: two jobs in one booth at once; a layer before the layer under it is
 * dry (or before an earlier layer), or after its recoat window has closed; a job finishing after its due date; a
 * session before the job's prep sign-off is planned; spraying outside the booth's hours.
 */
export function findConflicts(sessions: readonly Session[], facts: ScheduleFacts): Conflict[] {
  const booths = new Map(facts.booths.map((b) => [b.id, b]));
  const jobs = new Map(facts.jobs.map((j) => [j.id, j]));
  const layerOf = (s: Session): ScheduleLayer | undefined => jobs.get(s.jobId)?.layers.find((l) => l.id === s.layerId);
  const out: Conflict[] = [];

  // Two sessions in one booth at once (sweep in start order).
  const byBooth = new Map<number, number[]>();
  sessions.forEach((s, i) => byBooth.set(s.boothId, [...(byBooth.get(s.boothId) ?? []), i]));
  for (const [boothId, list] of byBooth) {
    const sorted = [...list].sort((a, b) => sessions[a]!.startsAt - sessions[b]!.startsAt);
    const open: number[] = [];
    for (const i of sorted) {
      const s = sessions[i]!;
      for (const j of open.filter((k) => sessions[k]!.endsAt > s.startsAt)) {
        const other = sessions[j]!;
        const names = [jobs.get(other.jobId)?.title ?? `job #${other.jobId}`, jobs.get(s.jobId)?.title ?? `job #${s.jobId}`];
        out.push({ kind: "booth_overlap", sessions: [j, i], jobId: s.jobId, message: `${booths.get(boothId)?.name ?? "The booth"} is booked twice at once: ${names[0]} and ${names[1]}` });
      }
      open.splice(0, open.length, ...open.filter((k) => sessions[k]!.endsAt > s.startsAt), i);
    }
  }

  for (const [i, s] of sessions.entries()) {
    const booth = booths.get(s.boothId);
    const job = jobs.get(s.jobId);
    const layer = layerOf(s);
    if (!booth || !job || !layer) continue;
    const tz = booth.timeZone;

    // The layer under this one, if it is on the schedule too.
    const below = job.layers.filter((l) => l.position < layer.position).at(-1);
    const belowIndex = below ? sessions.findIndex((o) => o.jobId === s.jobId && o.layerId === below.id) : -1;
    if (below && belowIndex >= 0) {
      const under = sessions[belowIndex]!;
      const underBooth = booths.get(under.boothId) ?? booth;
      const window = nextLayerWindow(under, underBooth, below);
      if (s.startsAt < under.startsAt)
        out.push({ kind: "out_of_order", sessions: [belowIndex, i], jobId: s.jobId, message: `${job.title}: ${layer.name} is booked before ${below.name}, which goes under it` });
      else if (s.startsAt < window.opensAt)
        out.push({ kind: "too_soon", sessions: [belowIndex, i], jobId: s.jobId, message: `${job.title}: ${layer.name} starts before ${below.name} is ready for it (from ${clock(window.opensAt, tz)})` });
      else if (window.closesAt != null && s.startsAt > window.closesAt)
        out.push({ kind: "too_late", sessions: [belowIndex, i], jobId: s.jobId, message: `${job.title}: ${layer.name} starts after ${below.name}'s recoat window closed (${clock(window.closesAt, tz)})` });
    } else if (below && sessions.some((o) => o.jobId === s.jobId && job.layers.find((l) => l.id === o.layerId && l.position < below.position))) {
      out.push({ kind: "out_of_order", sessions: [i], jobId: s.jobId, message: `${job.title}: ${below.name} is not booked, but layers on either side of it are` });
    }

    if (job.dueDate && s.endsAt > endOfDate(job.dueDate, tz))
      out.push({ kind: "due_at_risk", sessions: [i], jobId: s.jobId, message: `${job.title}: ${layer.name} ends after the job is due (${job.dueDate})` });
    if (job.prepReadyAt == null)
      out.push({ kind: "before_prep", sessions: [i], jobId: s.jobId, message: `${job.title}: booked before its prep sign-off is planned` });
    else if (s.startsAt < job.prepReadyAt)
      out.push({ kind: "before_prep", sessions: [i], jobId: s.jobId, message: `${job.title}: ${layer.name} starts before prep is signed off (planned ${clock(job.prepReadyAt, tz)})` });
    if (!sprayFitsHours(s.startsAt, sprayMinutes(booth, layer), booth))
      out.push({ kind: "outside_hours", sessions: [i], jobId: s.jobId, message: `${job.title}: ${layer.name} is sprayed outside ${booth.name}'s hours` });
  }
  return out;
}
