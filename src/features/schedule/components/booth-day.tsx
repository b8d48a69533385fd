import { useQuery } from "@tanstack/react-query";
import { Link } from "react-router";
import { paths } from "@/config/paths";
import { scheduleQueries } from "../api/schedule.queries";
import { timeText } from "./schedule-range";

function today() {
  const from = new Date();
  from.setHours(0, 0, 0, 0);
  const to = new Date(from);
  to.setDate(from.getDate() + 1);
  return { from: from.toISOString(), to: to.toISOString() };
}

/** Today's booth sessions on the booth page: a painter's own, or every booth's for the owner. */
export function BoothDay({ mine }: { mine: boolean }) {
  const { from, to } = today();
  const schedule = useQuery(scheduleQueries.range(from, to));
  const sessions = schedule.data?.sessions ?? [];
  const boothName = (id: number) => schedule.data?.booths.find((b) => b.id === id)?.name ?? "Booth";
  if (schedule.isPending || schedule.error) return null;
  return (
    <section aria-labelledby="booth-day-heading" className="mb-6 rounded-2xl border-2 border-primer-300 bg-white p-4">
      <h2 id="booth-day-heading" className="text-lg font-semibold">
        {mine ? "Your booth time today" : "Booth time today"}
      </h2>
      {sessions.length === 0 ? (
        <p className="text-primer-800">Nothing booked today.</p>
      ) : (
        <ol className="mt-2 flex flex-col divide-y divide-primer-200">
          {sessions.map((s) => (
            <li key={s.id ?? `${s.jobId}-${s.layerId}`} className="flex flex-wrap items-baseline gap-x-3 py-2">
              <span className="w-32 shrink-0 font-semibold tabular-nums">
                {timeText(Date.parse(s.startsAt))}–{timeText(Date.parse(s.endsAt))}
              </span>
              <span className="text-primer-800">{boothName(s.boothId)}</span>
              <Link to={paths.booth(s.jobId)} className="font-semibold text-ink-950 underline-offset-2 hover:underline">
                {s.jobTitle}: {s.layerName}
              </Link>
              <span className="text-sm text-primer-800">last coat by {timeText(Date.parse(s.sprayEndsAt))}</span>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
