import { CalendarClock, FlaskRound, TriangleAlert } from "lucide-react";
import { TIMING_RULE_LABELS } from "@shared/domain/booth-timing";
import { cardBreaches, cardWindows } from "@shared/domain/booth-card-timing";
import type { BoothDto } from "@shared/schemas/booth.schema";
import { Alert } from "@/components/ui/alert";
import { formatDateTime } from "@/utils/format-date";
import { formatAgo, formatCountdown } from "../hooks/use-server-now";
import { formatClock, TimerBox } from "./booth-timers";

/** The timing rules the next coat would break at `now` (shared with the server's check). */
export const breachesAt = cardBreaches;

/** Induction of the open batch and the previous layer's recoat window, when the next coat has them. */
export function TimingWindowTimers({ card, now }: { card: BoothDto; now: number }) {
  const next = card.next;
  if (next.state !== "spray") return null;
  const w = cardWindows(next);
  const prev = card.layers.filter((l) => !l.isPrep).find((_, i, all) => all[i + 1]?.id === next.layerId);
  return (
    <>
      {w.inductionEndsAt != null ? (
        w.inductionEndsAt > now ? (
          <TimerBox tone="wait" icon={<FlaskRound aria-hidden />} label="Induction time left" big={formatCountdown(w.inductionEndsAt - now)} detail={`The batch stands until ${formatClock(new Date(w.inductionEndsAt).toISOString())} before spraying`} testId="induction-timer" />
        ) : (
          <TimerBox tone="ready" icon={<FlaskRound aria-hidden />} label="Induction over" big="Ready" detail={`The batch has stood its induction time (since ${formatClock(new Date(w.inductionEndsAt).toISOString())}).`} testId="induction-timer" compact />
        )
      ) : null}
      {w.recoatClosesAt != null && prev ? (
        w.recoatClosesAt > now ? (
          <TimerBox
            tone={w.recoatClosesAt - now < 30 * 60_000 ? "warn" : "info"}
            icon={<CalendarClock aria-hidden />}
            label="Recoat window closes in"
            big={formatCountdown(w.recoatClosesAt - now)}
            detail={`${next.layerName} goes over ${prev.name} by ${formatClock(new Date(w.recoatClosesAt).toISOString())}`}
            testId="recoat-timer"
          />
        ) : (
          <TimerBox tone="danger" icon={<CalendarClock aria-hidden />} label="Recoat window closed" big="Closed" detail={`Closed ${formatAgo(now - w.recoatClosesAt)} ago. Check ${prev.name}'s data sheet: it may need scuffing before recoating.`} testId="recoat-timer" />
        )
      ) : null}
    </>
  );
}

/** Coats that went on against a timing rule, with the painter's reason: on the booth card and the job page. */
export function TimingOverrides({ card }: { card: BoothDto }) {
  if (!card.timingOverrides.length) return null;
  return (
    <Alert tone="warning" title="Sprayed against a timing rule">
      <ul className="flex flex-col gap-1" aria-label="Coats sprayed against a timing rule">
        {card.timingOverrides.map((o) => (
          <li key={o.coatLogId} className="flex items-start gap-1.5">
            <TriangleAlert aria-hidden className="mt-0.5 size-4 shrink-0" />
            <span>
              Coat {o.coatNumber} of {o.layerName} ({o.breaches.map((b) => TIMING_RULE_LABELS[b.rule].toLowerCase()).join(", ")}): {o.reason} ({o.byName ?? "Former user"}, {formatDateTime(o.at)})
            </span>
          </li>
        ))}
      </ul>
    </Alert>
  );
}
