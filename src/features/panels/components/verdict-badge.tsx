import { COLOUR_VERDICT_LABELS, type ColourVerdict } from "@shared/domain/colour-verdict";
import { cn } from "@/utils/cn";

const TONE: Record<ColourVerdict, string> = {
  match: "border-emerald-700 bg-emerald-50 text-emerald-950",
  close: "border-flake-600 bg-flake-50 text-flake-900",
  different: "border-red-700 bg-red-50 text-red-950",
};

/** The shop's tolerance verdict with ΔE00 beside it, e.g. "Within tolerance (ΔE00 0.91)". */
export function VerdictBadge({ verdict, deltaE, text, className }: { verdict: ColourVerdict; deltaE: number; text?: string; className?: string }) {
  return (
    <span title={text} className={cn("inline-flex items-center gap-2 rounded-full border-2 px-3 py-1 text-sm font-semibold", TONE[verdict], className)}>
      {COLOUR_VERDICT_LABELS[verdict]}
      <span className="font-normal tabular-nums">(ΔE00 {deltaE.toFixed(2)})</span>
    </span>
  );
}
