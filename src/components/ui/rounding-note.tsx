import { TriangleAlert } from "lucide-react";
import { formatAmount } from "@/utils/format-quantity";
import { roundingHeadline, smallPercent } from "./rounding-words";

export type RoundingNoteLine = { name: string; ratioErrorPct: number; reference: string[] };

export type RoundingNoteProps = {
  step: number;
  unit: string;
  lines: RoundingNoteLine[];
  /** Components whose ratio moved beyond the tolerance, worst first. */
  moved: string[];
  tolerancePct: number;
  exactTotal?: number;
  roundedTotal?: number;
  raisedFromZero?: string[];
  /** Display names by component name (e.g. "S5-B02 Intercoat clear"). */
  names?: Record<string, string>;
};

/** What rounding to a cup or scale step did to the mix: every component whose ratio moved, against what. */
export function RoundingNote({ step, unit, lines, moved, tolerancePct, exactTotal, roundedTotal, raisedFromZero = [], names = {} }: RoundingNoteProps) {
  const label = (n: string) => names[n] ?? n;
  const stepText = formatAmount(step, unit, 4);
  const extra = exactTotal !== undefined && roundedTotal !== undefined && roundedTotal - exactTotal > step * 1e-6 ? roundedTotal - exactTotal : 0;
  const makes = extra > 0 ? ` The batch comes to ${formatAmount(roundedTotal!, unit, 4)}, ${formatAmount(extra, unit, 4)} more than asked.` : "";
  const raised = raisedFromZero.length ? ` Raised from zero to one step: ${raisedFromZero.map(label).join(", ")}.` : "";
  const worstPct = Math.max(0, ...lines.map((l) => Math.abs(l.ratioErrorPct)));
  const headline = roundingHeadline({ stepText, worstPct, tolerancePct, movedCount: moved.length });
  if (moved.length === 0) {
    return (
      <p role="status" className="text-sm text-primer-700">
        {headline}
        {makes}
        {raised}
      </p>
    );
  }
  const byName = new Map(lines.map((l) => [l.name, l]));
  return (
    <div role="status" className="flex items-start gap-2 rounded-lg border-l-4 border-flake-600 bg-flake-50 px-3 py-2 text-sm text-flake-900">
      <TriangleAlert aria-hidden className="mt-0.5 size-4 shrink-0" />
      <div>
        <p className="font-semibold">{headline}</p>
        <ul className="ml-4 list-disc">
          {moved.map((n) => {
            const l = byName.get(n)!;
            return (
              <li key={n}>
                {label(n)}: {smallPercent(Math.abs(l.ratioErrorPct))} % off its ratio to {l.reference.map(label).join(" + ")}
              </li>
            );
          })}
        </ul>
        <p>
          Use a finer step or a bigger batch, or measure the exact amounts.{makes}
          {raised}
        </p>
      </div>
    </div>
  );
}
