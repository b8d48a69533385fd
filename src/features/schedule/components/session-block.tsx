import { useRef, useState } from "react";
import { TriangleAlert } from "lucide-react";
import type { BoothDto, SessionDto } from "@shared/schemas/schedule.schema";
import { cn } from "@/utils/cn";
import { HOUR_MS, QUARTER_MS, snap, timeText, whenText } from "./schedule-range";

export type MoveTo = { boothId: number; startsAt: number };

type Props = {
  session: SessionDto;
  booths: readonly BoothDto[];
  /** The span the lane shows, and its width in px when the drag starts (read from the lane). */
  from: number;
  to: number;
  laneWidth: () => number;
  laneHeight: number;
  conflicted: boolean;
  /** Whether this user may move sessions (the office). */
  movable: boolean;
  onMove: (id: number, to: MoveTo) => void;
  onAnnounce: (text: string) => void;
};

/**
 * One booked layer on a booth's lane: the spraying part solid, the cure kept in the booth striped. The office moves
 * it by dragging (15-minute steps; up or down for another booth), or from the keyboard: arrow keys move it (Shift for
 * an hour), Enter saves, Escape puts it back.
 */
export function SessionBlock({ session, booths, from, to, laneWidth, laneHeight, conflicted, movable, onMove, onAnnounce }: Props) {
  const start = Date.parse(session.startsAt);
  const sprayEnd = Date.parse(session.sprayEndsAt);
  const end = Date.parse(session.endsAt);
  const [pending, setPending] = useState<MoveTo | null>(null);
  const drag = useRef<{ x: number; y: number; width: number } | null>(null);
  const boothIndex = booths.findIndex((b) => b.id === session.boothId);
  const at = pending?.startsAt ?? start;
  const span = to - from;
  const left = ((at - from) / span) * 100;
  const width = Math.max(((end - start) / span) * 100, 0.6);
  const sprayShare = end > start ? ((sprayEnd - start) / (end - start)) * 100 : 100;
  const boothName = (id: number) => booths.find((b) => b.id === id)?.name ?? "booth";
  const shiftBooths = pending ? booths.findIndex((b) => b.id === pending.boothId) - boothIndex : 0;

  const describe = (m: MoveTo) => `${session.jobTitle}, ${session.layerName}: ${boothName(m.boothId)}, ${whenText(m.startsAt)}`;
  const propose = (m: MoveTo) => {
    setPending(m);
    onAnnounce(`${describe(m)}. Enter saves, Escape puts it back.`);
  };
  const commit = () => {
    if (pending && session.id != null && (pending.startsAt !== start || pending.boothId !== session.boothId)) onMove(session.id, pending);
    setPending(null);
  };

  const onKeyDown = (e: React.KeyboardEvent) => {
    if (!movable) return;
    const base = pending ?? { boothId: session.boothId, startsAt: start };
    const step = e.shiftKey ? HOUR_MS : QUARTER_MS;
    const index = booths.findIndex((b) => b.id === base.boothId);
    if (e.key === "ArrowRight" || e.key === "ArrowLeft") propose({ ...base, startsAt: base.startsAt + (e.key === "ArrowRight" ? step : -step) });
    else if (e.key === "ArrowDown" && index < booths.length - 1) propose({ ...base, boothId: booths[index + 1]!.id });
    else if (e.key === "ArrowUp" && index > 0) propose({ ...base, boothId: booths[index - 1]!.id });
    else if (e.key === "Enter" && pending) commit();
    else if (e.key === "Escape" && pending) {
      setPending(null);
      onAnnounce(`${session.jobTitle}, ${session.layerName}: left where it was.`);
    } else return;
    e.preventDefault();
  };

  const onPointerDown = (e: React.PointerEvent<HTMLButtonElement>) => {
    if (!movable || e.button !== 0) return;
    drag.current = { x: e.clientX, y: e.clientY, width: laneWidth() };
    e.currentTarget.setPointerCapture(e.pointerId);
  };
  const onPointerMove = (e: React.PointerEvent) => {
    const d = drag.current;
    if (!d || d.width <= 0) return;
    const dx = e.clientX - d.x;
    const dy = e.clientY - d.y;
    if (Math.abs(dx) < 4 && Math.abs(dy) < 4 && !pending) return;
    const lane = Math.min(Math.max(boothIndex + Math.round(dy / laneHeight), 0), booths.length - 1);
    setPending({ boothId: booths[lane]!.id, startsAt: snap(start + (dx / d.width) * span) });
  };
  const onPointerUp = () => {
    if (!drag.current) return;
    drag.current = null;
    commit();
  };

  return (
    <button
      type="button"
      data-session-id={session.id ?? undefined}
      aria-describedby={movable ? "schedule-move-help" : undefined}
      className={cn(
        "absolute top-1 bottom-1 flex touch-none overflow-hidden rounded-lg border-2 text-left text-xs shadow-card focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-candy-600",
        conflicted ? "border-red-700" : "border-ink-900",
        pending ? "z-10 opacity-90 ring-4 ring-candy-300" : "",
        movable ? "cursor-grab active:cursor-grabbing" : "cursor-default",
      )}
      style={{ left: `${left}%`, width: `${width}%`, minWidth: "1.75rem", transform: shiftBooths ? `translateY(${shiftBooths * laneHeight}px)` : undefined }}
      onKeyDown={onKeyDown}
      onPointerDown={onPointerDown}
      onPointerMove={onPointerMove}
      onPointerUp={onPointerUp}
      onPointerCancel={() => {
        drag.current = null;
        setPending(null);
      }}
      onBlur={() => pending && !drag.current && setPending(null)}
    >
      <span className="flex h-full min-w-0 flex-col justify-center bg-ink-900 px-1.5 text-white" style={{ width: `${sprayShare}%` }}>
        <span className="flex items-center gap-1 truncate font-semibold">
          {conflicted ? <TriangleAlert aria-hidden className="size-3.5 shrink-0 text-red-300" /> : null}
          <span className="truncate">
            {session.jobTitle}
            <span className="sr-only">, </span>
          </span>
        </span>
        <span className="truncate">
          {session.layerName}
          <span className="sr-only">
            : {timeText(start)} to {timeText(end)}, last coat by {timeText(sprayEnd)}
            {conflicted ? ", has a conflict" : ""}
          </span>
        </span>
      </span>
      {sprayShare < 100 ? <span aria-hidden className="h-full flex-1 bg-[repeating-linear-gradient(135deg,#dedbd3_0_6px,#eeece7_6px_12px)]" /> : null}
    </button>
  );
}
