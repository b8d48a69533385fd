import type { ComponentProps, ReactNode } from "react";
import { cn } from "@/utils/cn";
import { controlClasses, Field } from "./field";

type TextareaFieldProps = Omit<ComponentProps<"textarea">, "id"> & {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  fieldClassName?: string;
};

export function TextareaField({ label, error, hint, required, fieldClassName, className, rows = 3, ...textarea }: TextareaFieldProps) {
  return (
    <Field label={label} error={error} hint={hint} required={required} className={fieldClassName}>
      {(control) => <textarea rows={rows} {...control} {...textarea} className={cn(controlClasses, "resize-y", className)} />}
    </Field>
  );
}
