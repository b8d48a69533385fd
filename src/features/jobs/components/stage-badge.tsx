import { STAGE_LABELS, type Stage } from "@shared/domain/stages";
import { cn } from "@/utils/cn";

/** Each stage has its own colour; the label is always written out, so colour is never the only cue. */
export const STAGE_TONES: Record<Stage, { badge: string; bar: string }> = {
  inquiry: { badge: "bg-primer-100 text-primer-800 ring-primer-300", bar: "bg-primer-400" },
  quoted: { badge: "bg-sky-50 text-sky-900 ring-sky-300", bar: "bg-sky-500" },
  booked: { badge: "bg-ink-50 text-ink-800 ring-ink-200", bar: "bg-ink-500" },
  in_prep: { badge: "bg-flake-50 text-flake-800 ring-flake-300", bar: "bg-flake-500" },
  in_booth: { badge: "bg-candy-50 text-candy-800 ring-candy-200", bar: "bg-candy-600" },
  curing: { badge: "bg-violet-50 text-violet-900 ring-violet-300", bar: "bg-violet-500" },
  finishing: { badge: "bg-teal-50 text-teal-900 ring-teal-300", bar: "bg-teal-600" },
  ready: { badge: "bg-emerald-50 text-emerald-900 ring-emerald-300", bar: "bg-emerald-600" },
  delivered: { badge: "bg-white text-primer-700 ring-primer-300", bar: "bg-primer-300" },
  cancelled: { badge: "bg-white text-primer-700 ring-primer-300 line-through decoration-primer-500", bar: "bg-primer-200" },
};

export function StageBadge({ stage, size = "md", className }: { stage: Stage; size?: "md" | "lg"; className?: string }) {
  return (
    <span
      className={cn(
        "inline-flex items-center gap-1.5 rounded-full font-semibold whitespace-nowrap ring-1 ring-inset",
        size === "lg" ? "px-3 py-1 text-sm" : "px-2.5 py-0.5 text-xs",
        STAGE_TONES[stage].badge,
        className,
      )}
    >
      <span aria-hidden className={cn("size-2 rounded-full", STAGE_TONES[stage].bar)} />
      {STAGE_LABELS[stage]}
    </span>
  );
}
