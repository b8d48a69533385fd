import { useId, type ReactNode } from "react";
import { cn } from "@/utils/cn";

export type FieldControlProps = {
  id: string;
  "aria-invalid": boolean | undefined;
  "aria-describedby": string | undefined;
  "aria-required": boolean | undefined;
};

/** Label, control, hint and error for one input; the control gets the ids that tie them together. */
export function Field({
  label,
  error,
  hint,
  required,
  className,
  labelClassName,
  children,
}: {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  required?: boolean;
  className?: string;
  labelClassName?: string;
  children: (control: FieldControlProps) => ReactNode;
}) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [errorId, hintId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={cn("flex flex-col gap-1.5", className)}>
      <div className="flex items-baseline gap-1">
        <label htmlFor={id} className={cn("text-sm font-semibold text-ink-950", labelClassName)}>
          {label}
        </label>
        {required ? (
          <span aria-hidden className="text-sm font-semibold text-candy-700" title="Required">
            *
          </span>
        ) : null}
      </div>
      {children({ id, "aria-invalid": error ? true : undefined, "aria-describedby": describedBy, "aria-required": required || undefined })}
      {hint ? (
        <p id={hintId} className="text-sm text-primer-700">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errorId} className="text-sm font-medium text-red-800">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export const controlClasses = cn(
  "block min-h-11 w-full rounded-lg border border-primer-400 bg-white px-3 py-2 text-base text-ink-950 shadow-inner shadow-primer-100",
  "placeholder:text-primer-500 disabled:bg-primer-100 disabled:text-primer-700",
  "aria-invalid:border-red-700 aria-invalid:bg-red-50/40",
);
