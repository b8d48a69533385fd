import type { ComponentProps, ReactNode } from "react";
import { cn } from "@/utils/cn";
import { controlClasses, Field } from "./field";

type TextFieldProps = Omit<ComponentProps<"input">, "id"> & {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  fieldClassName?: string;
};

export function TextField({ label, error, hint, required, fieldClassName, className, ...input }: TextFieldProps) {
  return (
    <Field label={label} error={error} hint={hint} required={required} className={fieldClassName}>
      {(control) => <input {...control} {...input} className={cn(controlClasses, className)} />}
    </Field>
  );
}
