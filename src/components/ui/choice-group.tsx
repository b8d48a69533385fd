import { useId, type ReactNode } from "react";
import { cn } from "@/utils/cn";

type Option<V extends string> = { value: V; label: ReactNode };

const chipClasses = (active: boolean) =>
  cn(
    "inline-flex min-h-11 items-center gap-1.5 rounded-full border px-4 text-sm font-semibold whitespace-nowrap transition-colors",
    active ? "border-ink-900 bg-ink-900 text-white" : "border-primer-300 bg-white text-ink-900 hover:bg-primer-100",
  );

/** Pick any number: a row of toggle buttons (aria-pressed). */
export function MultiChoice<V extends string>({
  label,
  options,
  value,
  onChange,
  className,
}: {
  label: string;
  options: Option<V>[];
  value: readonly V[];
  onChange: (value: V[]) => void;
  className?: string;
}) {
  const labelId = useId();
  return (
    <div role="group" aria-labelledby={labelId} className={cn("flex flex-col gap-1.5", className)}>
      <span id={labelId} className="text-sm font-semibold text-ink-950">
        {label}
      </span>
      <div className="flex flex-wrap gap-2">
        {options.map((o) => {
          const active = value.includes(o.value);
          return (
            <button
              key={o.value}
              type="button"
              aria-pressed={active}
              onClick={() => onChange(active ? value.filter((v) => v !== o.value) : [...value, o.value])}
              className={chipClasses(active)}
            >
              {o.label}
            </button>
          );
        })}
      </div>
    </div>
  );
}

/** Pick one: a segmented radio group built on real radio inputs (arrow keys work). */
export function SingleChoice<V extends string>({
  label,
  options,
  value,
  onChange,
  className,
}: {
  label: string;
  options: Option<V>[];
  value: V;
  onChange: (value: V) => void;
  className?: string;
}) {
  const name = useId();
  return (
    <fieldset className={cn("flex flex-col gap-1.5", className)}>
      <legend className="mb-1.5 text-sm font-semibold text-ink-950">{label}</legend>
      <div className="flex flex-wrap gap-2">
        {options.map((o) => {
          const active = o.value === value;
          return (
            <label key={o.value} className={cn(chipClasses(active), "cursor-pointer has-focus-visible:outline-3 has-focus-visible:outline-offset-2 has-focus-visible:outline-candy-600")}>
              <input type="radio" name={name} value={o.value} checked={active} onChange={() => onChange(o.value)} className="sr-only" />
              {o.label}
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}
