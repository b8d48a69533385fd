import type { ComponentProps, ReactNode } from "react";
import { ChevronDown } from "lucide-react";
import { cn } from "@/utils/cn";
import { controlClasses, Field } from "./field";

type SelectFieldProps = Omit<ComponentProps<"select">, "id"> & {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  fieldClassName?: string;
};

export function SelectField({ label, error, hint, required, fieldClassName, className, children, ...select }: SelectFieldProps) {
  return (
    <Field label={label} error={error} hint={hint} required={required} className={fieldClassName}>
      {(control) => (
        <div className="relative">
          <select {...control} {...select} className={cn(controlClasses, "appearance-none pr-10", className)}>
            {children}
          </select>
          <ChevronDown aria-hidden className="pointer-events-none absolute top-1/2 right-3 size-5 -translate-y-1/2 text-primer-600" />
        </div>
      )}
    </Field>
  );
}
