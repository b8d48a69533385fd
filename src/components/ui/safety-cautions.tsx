import { ShieldAlert } from "lucide-react";
import type { Caution } from "@shared/domain/safety";
import { cn } from "@/utils/cn";

/**
 * The safety reminders for a layer or batch (isocyanates, flammable solvents), always with the line that defers
 * to the product's safety data sheet. Renders nothing when there are none.
 */
export function SafetyCautions({ cautions, compact = false, className }: { cautions: Caution[]; compact?: boolean; className?: string }) {
  if (cautions.length === 0) return null;
  return (
    <div role="note" aria-label="Safety" className={cn("rounded-lg border-l-4 border-flake-600 bg-flake-50 text-flake-900", compact ? "px-3 py-2 text-xs" : "px-4 py-3 text-sm", className)}>
      <p className="flex items-center gap-2 font-semibold">
        <ShieldAlert aria-hidden className={compact ? "size-4" : "size-5"} />
        Safety
      </p>
      <ul className={cn("mt-1 space-y-1", compact ? "" : "pl-7")}>
        {cautions.map((c) => (
          <li key={c.id}>
            <span className="font-semibold">{c.title}.</span> {compact && c.id !== "defer" ? null : c.text}
          </li>
        ))}
      </ul>
    </div>
  );
}
