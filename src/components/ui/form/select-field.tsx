import type { ComponentProps, ReactNode } from "react";
import { Field } from "./field";
import { Select } from "./select";

type SelectFieldProps = Omit<ComponentProps<"select">, "id"> & {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  fieldClassName?: string;
};

export function SelectField({ label, error, hint, required, fieldClassName, children, ...select }: SelectFieldProps) {
  return (
    <Field label={label} error={error} hint={hint} required={required} className={fieldClassName}>
      {(control) => (
        <Select {...control} {...select}>
          {children}
        </Select>
      )}
    </Field>
  );
}
