import { forwardRef, type ComponentProps, type ReactNode } from "react";
import { Minus, Plus } from "lucide-react";
import { cn } from "@/utils/cn";
import { controlClasses, Field } from "@/components/ui/form/field";

/**
 * A number with big − and + buttons beside it, so the painter can adjust it with gloves on and without a screen
 * keyboard; the field itself still takes typing (decimal keyboard on tablets).
 */
export const ConditionInput = forwardRef<
  HTMLInputElement,
  Omit<ComponentProps<"input">, "id"> & { label: string; error?: string; suffix: string; onStep: (delta: number) => void; step?: number; labelAside?: ReactNode }
>(function ConditionInput({ label, error, suffix, onStep, step = 1, labelAside, className, ...input }, ref) {
  const button = "grid size-14 shrink-0 place-items-center rounded-xl border-2 border-ink-800 bg-white text-ink-950 active:bg-primer-200 [&_svg]:size-6";
  return (
    <Field label={label} error={error} labelClassName="text-base">
      {(control) => (
        <div className="flex items-center gap-2">
          {labelAside ? <div className="order-last">{labelAside}</div> : null}
          <button type="button" className={button} onClick={() => onStep(-step)}>
            <Minus aria-hidden />
            <span className="sr-only">Lower {label.toLowerCase()}</span>
          </button>
          <div className="relative min-w-0 flex-1">
            <input
              ref={ref}
              {...control}
              {...input}
              type="text"
              inputMode="decimal"
              autoComplete="off"
              className={cn(controlClasses, "min-h-14 text-center text-2xl font-semibold tabular-nums", suffix && "pr-12", className)}
            />
            {suffix ? (
              <span aria-hidden className="pointer-events-none absolute top-1/2 right-3 -translate-y-1/2 text-lg font-semibold text-primer-700">
                {suffix}
              </span>
            ) : null}
          </div>
          <button type="button" className={button} onClick={() => onStep(step)}>
            <Plus aria-hidden />
            <span className="sr-only">Raise {label.toLowerCase()}</span>
          </button>
        </div>
      )}
    </Field>
  );
});
