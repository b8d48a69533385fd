import { mixComponentWords, plainNumber, type WordedComponent } from "@shared/domain/mix-words";
import { cn } from "@/utils/cn";

/**
 * A layer's mix, one component per row: the material (code and name), its amount as the plan gives it (parts, or a
 * percent of named materials) and its share of the ready-to-spray mix.
 */
export function MixWordsList({ components, className, large = false }: { components: readonly WordedComponent[]; className?: string; large?: boolean }) {
  if (components.length === 0) return null;
  return (
    <ul className={cn("flex flex-col gap-0.5", large ? "text-base" : "text-sm", className)} aria-label="Mix">
      {mixComponentWords(components).map((w) => (
        <li key={w.label}>
          <span className="font-semibold">{w.material}</span> <span className="text-primer-700">({w.label})</span>: {w.amount}
          {w.readyPct !== null ? <span className="text-primer-700"> · {plainNumber(w.readyPct, 1)} % of the ready-to-spray mix</span> : null}
        </li>
      ))}
    </ul>
  );
}
