import { useRef, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { ChevronLeft, ChevronRight } from "lucide-react";
import type { BoothDto, ConflictDto, SessionDto } from "@shared/schemas/schedule.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { SingleChoice } from "@/components/ui/choice-group";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { scheduleQueries, useMoveSession } from "../api/schedule.queries";
import { dayText, marksOf, shiftDay, spanOf, timeText, type ScheduleSpan } from "./schedule-range";
import { SessionBlock, type MoveTo } from "./session-block";

const LANE_HEIGHT = 72;

type Props = {
  /** The office moves sessions; a painter only reads. */
  movable: boolean;
  /** Shown instead of the saved sessions (a suggestion being reviewed). */
  preview?: { sessions: SessionDto[]; conflicts: ConflictDto[] } | null;
};

/** Booth lanes over a day or a week, with every conflict listed under them. */
export function ScheduleView({ movable, preview }: Props) {
  const [kind, setKind] = useState<ScheduleSpan>("week");
  const [day, setDay] = useState(() => new Date());
  const { from, to } = spanOf(kind, day);
  const schedule = useQuery(scheduleQueries.range(new Date(from).toISOString(), new Date(to).toISOString()));
  const move = useMoveSession();
  const [announcement, setAnnouncement] = useState("");
  const lanes = useRef<HTMLDivElement>(null);

  const booths: BoothDto[] = (schedule.data?.booths ?? []).filter((b) => b.active);
  const sessions = preview?.sessions ?? schedule.data?.sessions ?? [];
  const conflicts = preview?.conflicts ?? schedule.data?.conflicts ?? [];
  const conflicted = new Set(conflicts.flatMap((c) => c.sessionIds));
  const marks = marksOf(kind, from, to);

  const onMove = async (id: number, m: MoveTo) => {
    const version = sessions.find((s) => s.id === id)?.version ?? 1;
    try {
      const res = await move.mutateAsync({ id, version, boothId: m.boothId, startsAt: new Date(m.startsAt).toISOString() });
      const left = res.conflicts.length;
      setAnnouncement(left ? `Moved. ${left} conflict${left === 1 ? "" : "s"} left.` : "Moved. No conflicts.");
      toast.success(left ? `Moved; ${left} conflict${left === 1 ? "" : "s"} left` : "Moved; no conflicts");
    } catch (err) {
      toast.error(isApiError(err) ? err.message : "Could not move the session");
    }
  };

  return (
    <section aria-labelledby="schedule-lanes-heading" className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="schedule-lanes-heading" className="text-xl font-semibold">
          {kind === "day" ? dayText(from) : `Week of ${dayText(from)}`}
          {preview ? " · suggestion (not saved)" : ""}
        </h2>
        <div className="flex flex-wrap items-end gap-2">
          <SingleChoice<ScheduleSpan> label="Show" value={kind} onChange={setKind} options={[{ value: "day", label: "Day" }, { value: "week", label: "Week" }]} />
          <Button variant="secondary" onClick={() => setDay(shiftDay(day, kind, -1))} aria-label={kind === "day" ? "Previous day" : "Previous week"}>
            <ChevronLeft aria-hidden className="size-5" />
          </Button>
          <Button variant="secondary" onClick={() => setDay(new Date())}>
            Today
          </Button>
          <Button variant="secondary" onClick={() => setDay(shiftDay(day, kind, 1))} aria-label={kind === "day" ? "Next day" : "Next week"}>
            <ChevronRight aria-hidden className="size-5" />
          </Button>
        </div>
      </div>
      {movable ? (
        <p id="schedule-move-help" className="text-sm text-primer-800">
          Drag a session to move it (up or down for another booth), or focus it and use the arrow keys (Shift for an hour), then Enter to save or Escape to put it back.
        </p>
      ) : null}
      <p aria-live="polite" className="sr-only">
        {announcement}
      </p>
      {schedule.isPending ? (
        <Spinner label="Loading the schedule…" />
      ) : schedule.error ? (
        <Alert tone="error">{schedule.error.message}</Alert>
      ) : booths.length === 0 ? (
        <Alert tone="info">No booths yet: the owner adds them under Settings.</Alert>
      ) : (
        <div className="overflow-x-auto rounded-xl border border-primer-300 bg-white select-none">
          <div className="grid min-w-[56rem] grid-cols-[8rem_1fr]">
            <div aria-hidden className="border-b border-primer-200" />
            <div className="relative h-8 border-b border-primer-200 text-xs text-primer-800">
              {marks.map((t) =>
                kind === "day" ? (
                  <span key={t} aria-hidden className="absolute top-1.5 pl-1" style={{ left: `${((t - from) / (to - from)) * 100}%` }}>
                    {timeText(t)}
                  </span>
                ) : (
                  <button
                    key={t}
                    type="button"
                    className="absolute top-0.5 rounded px-1 py-1 font-semibold text-ink-900 underline-offset-2 hover:underline"
                    style={{ left: `${((t - from) / (to - from)) * 100}%` }}
                    aria-label={`Show ${dayText(t)} by the hour`}
                    onClick={() => {
                      setDay(new Date(t));
                      setKind("day");
                    }}
                  >
                    {dayText(t)}
                  </button>
                ),
              )}
            </div>
            {booths.map((b) => (
              <BoothLaneRow key={b.id} booth={b}>
                <div ref={b.id === booths[0]!.id ? lanes : undefined} className="relative border-b border-primer-200" style={{ height: LANE_HEIGHT }}>
                  {marks.map((t) => (
                    <span key={t} aria-hidden className="absolute top-0 bottom-0 border-l border-primer-200" style={{ left: `${((t - from) / (to - from)) * 100}%` }} />
                  ))}
                  {sessions
                    .filter((s) => s.boothId === b.id && Date.parse(s.endsAt) > from && Date.parse(s.startsAt) < to)
                    .map((s) => (
                      <SessionBlock
                        key={s.id ?? `${s.jobId}-${s.layerId}`}
                        session={s}
                        booths={booths}
                        from={from}
                        to={to}
                        laneWidth={() => lanes.current?.getBoundingClientRect().width ?? 0}
                        laneHeight={LANE_HEIGHT}
                        conflicted={s.id != null ? conflicted.has(s.id) : conflicts.some((c) => c.jobId === s.jobId)}
                        movable={movable && !preview && s.id != null}
                        onMove={onMove}
                        onAnnounce={setAnnouncement}
                      />
                    ))}
                </div>
              </BoothLaneRow>
            ))}
          </div>
        </div>
      )}
      <ConflictList conflicts={conflicts} />
    </section>
  );
}

function BoothLaneRow({ booth, children }: { booth: BoothDto; children: React.ReactNode }) {
  return (
    <>
      <div className="flex flex-col justify-center border-b border-r border-primer-200 px-3 text-sm">
        <span className="font-semibold">{booth.name}</span>
        <span className="text-xs text-primer-800">
          {booth.opensAt}–{booth.closesAt}
          {booth.canCureOutside ? " · cures outside" : ""}
        </span>
      </div>
      {children}
    </>
  );
}

function ConflictList({ conflicts }: { conflicts: readonly ConflictDto[] }) {
  return (
    <section aria-labelledby="schedule-conflicts-heading" className="rounded-xl border border-primer-300 bg-white p-4">
      <h2 id="schedule-conflicts-heading" className="text-lg font-semibold">
        Conflicts {conflicts.length ? `(${conflicts.length})` : ""}
      </h2>
      {conflicts.length === 0 ? (
        <p className="text-primer-800">None: no booth is booked twice, and every layer waits for the one under it.</p>
      ) : (
        <ul className="mt-2 flex list-disc flex-col gap-1 pl-5" aria-label="Conflicts">
          {conflicts.map((c, i) => (
            <li key={`${c.kind}-${c.sessionIds.join("-")}-${i}`} className="text-red-800">
              {c.message}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
