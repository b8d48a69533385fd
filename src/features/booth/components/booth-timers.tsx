import { Hourglass, Timer, FlaskConical } from "lucide-react";
import type { BoothTimerDto } from "@shared/schemas/booth.schema";
import { cn } from "@/utils/cn";
import { formatAgo, formatCountdown } from "../hooks/use-server-now";

const clock = new Intl.DateTimeFormat(undefined, { hour: "numeric", minute: "2-digit" });
const dayClock = new Intl.DateTimeFormat(undefined, { day: "numeric", month: "short", hour: "numeric", minute: "2-digit" });
/** "10:42 AM" today, "28 Nov, 10:42 AM" on another day. */
export const formatClock = (iso: string) => {
  const d = new Date(iso);
  return d.toDateString() === new Date().toDateString() ? clock.format(d) : dayClock.format(d);
};

/**
 * The flash (between coats) or dry (before the next layer) timer. Counts down to the end computed by the server
 * from the stored coat time; once over it says the next step may start.
 */
export function StepTimer({ timer, now, nextLabel }: { timer: BoothTimerDto | null; now: number; nextLabel: string }) {
  if (!timer) {
    return (
      <TimerBox tone="ready" icon={<Timer aria-hidden />} label="Timer" big="Ready" detail={`Nothing to wait for: ${nextLabel}.`} testId="step-timer" compact />
    );
  }
  const end = Date.parse(timer.endsAt);
  const start = Date.parse(timer.startedAt);
  const left = end - now;
  const what = timer.kind === "flash" ? "Flash" : "Dry";
  if (left > 0) {
    const fraction = Math.min(1, Math.max(0, (now - start) / Math.max(1, end - start)));
    return (
      <TimerBox
        tone="wait"
        icon={<Hourglass aria-hidden />}
        label={`${what} time left`}
        big={formatCountdown(left)}
        detail={`${timer.kind === "flash" ? "Next coat" : "Next layer"} from ${formatClock(timer.endsAt)}`}
        progress={fraction}
        testId="step-timer"
      />
    );
  }
  return (
    <TimerBox
      tone="ready"
      icon={<Timer aria-hidden />}
      label={`${what} time over`}
      big="Ready"
      detail={`${what} ended ${formatAgo(left)} ago (${formatClock(timer.endsAt)}): ${nextLabel}.`}
      testId="step-timer"
    />
  );
}

/** Pot life of the open batch: counts down from the mixing time; warns in the last 15 minutes and when it is over. */
export function PotLifeTimer({ endsAt, mixedAt, now }: { endsAt: string | null; mixedAt: string; now: number }) {
  if (!endsAt) {
    return <TimerBox tone="info" icon={<FlaskConical aria-hidden />} label="Pot life" big="—" detail={`Batch mixed at ${formatClock(mixedAt)}; its materials list no pot life.`} testId="pot-life" />;
  }
  const left = Date.parse(endsAt) - now;
  if (left <= 0) {
    return <TimerBox tone="danger" icon={<FlaskConical aria-hidden />} label="Pot life over" big="Over" detail={`Ended at ${formatClock(endsAt)}. Do not spray this batch; mix a fresh one.`} testId="pot-life" />;
  }
  return (
    <TimerBox
      tone={left < 15 * 60_000 ? "warn" : "info"}
      icon={<FlaskConical aria-hidden />}
      label="Pot life left"
      big={formatCountdown(left)}
      detail={`Batch mixed ${formatClock(mixedAt)}, usable until ${formatClock(endsAt)}`}
      testId="pot-life"
    />
  );
}

const TONES = {
  wait: "border-flake-600 bg-flake-50 text-flake-900",
  ready: "border-emerald-700 bg-emerald-50 text-emerald-950",
  info: "border-ink-500 bg-ink-50 text-ink-950",
  warn: "border-flake-700 bg-flake-100 text-flake-900",
  danger: "border-red-700 bg-red-50 text-red-950",
} as const;

export function TimerBox({
  tone,
  icon,
  label,
  big,
  detail,
  progress,
  testId,
  compact = false,
}: {
  tone: keyof typeof TONES;
  icon: React.ReactNode;
  label: string;
  big: string;
  detail: string;
  progress?: number;
  testId: string;
  compact?: boolean;
}) {
  if (compact) {
    return (
      <div role="timer" aria-label={label} data-testid={testId} className={cn("flex flex-wrap items-center gap-x-3 gap-y-1 rounded-xl border-2 px-4 py-2", TONES[tone])}>
        <span className="[&_svg]:size-5">{icon}</span>
        <span className="text-2xl font-bold" data-testid={`${testId}-value`}>
          {big}
        </span>
        <span className="text-sm font-medium">{detail}</span>
      </div>
    );
  }
  return (
    <div role="timer" aria-label={label} data-testid={testId} className={cn("flex min-w-0 flex-col gap-1 rounded-xl border-2 px-4 py-3", TONES[tone])}>
      <p className="flex items-center gap-2 text-base font-semibold [&_svg]:size-5">
        {icon}
        {label}
      </p>
      <p className="text-4xl font-bold tracking-tight tabular-nums sm:text-5xl" data-testid={`${testId}-value`}>
        {big}
      </p>
      <p className="text-sm font-medium">{detail}</p>
      {progress !== undefined ? (
        <div className="mt-1 h-2 overflow-hidden rounded-full bg-white/70" aria-hidden>
          <div className="h-full rounded-full bg-flake-600" style={{ width: `${Math.round(progress * 100)}%` }} />
        </div>
      ) : null}
    </div>
  );
}
