import { useId } from "react";
import { controlClasses } from "@/components/ui/form/field";
import { cn } from "@/utils/cn";

/** Two native date inputs ("From", "To") with an optional message under them. */
export function DateRangeFields({
  from,
  to,
  onChange,
  error,
  className,
}: {
  from: string;
  to: string;
  onChange: (patch: { from?: string; to?: string }) => void;
  error?: string;
  className?: string;
}) {
  const id = useId();
  return (
    <fieldset className={cn("flex flex-col gap-1.5", className)} aria-describedby={error ? `${id}-error` : undefined}>
      <legend className="sr-only">Date range</legend>
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1.5">
          <label htmlFor={`${id}-from`} className="text-sm font-semibold text-ink-950">
            From
          </label>
          <input id={`${id}-from`} type="date" value={from} onChange={(e) => onChange({ from: e.target.value })} className={cn(controlClasses, "w-auto")} aria-invalid={error ? true : undefined} />
        </div>
        <div className="flex flex-col gap-1.5">
          <label htmlFor={`${id}-to`} className="text-sm font-semibold text-ink-950">
            To
          </label>
          <input id={`${id}-to`} type="date" value={to} onChange={(e) => onChange({ to: e.target.value })} className={cn(controlClasses, "w-auto")} aria-invalid={error ? true : undefined} />
        </div>
      </div>
      {error ? (
        <p id={`${id}-error`} className="text-sm font-medium text-red-800">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}
