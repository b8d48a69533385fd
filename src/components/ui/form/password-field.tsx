import { useState, type ComponentProps, type ReactNode } from "react";
import { Eye, EyeOff } from "lucide-react";
import { cn } from "@/utils/cn";
import { controlClasses, Field } from "./field";

type PasswordFieldProps = Omit<ComponentProps<"input">, "id" | "type"> & {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  fieldClassName?: string;
};

/** A password input with a show/hide button (easier than typing twice with gloves on). */
export function PasswordField({ label, error, hint, required, fieldClassName, className, ...input }: PasswordFieldProps) {
  const [visible, setVisible] = useState(false);
  return (
    <Field label={label} error={error} hint={hint} required={required} className={fieldClassName}>
      {(control) => (
        <div className="relative">
          <input {...control} {...input} type={visible ? "text" : "password"} className={cn(controlClasses, "pr-12", className)} />
          <button
            type="button"
            onClick={() => setVisible((v) => !v)}
            aria-pressed={visible}
            className="absolute top-1/2 right-1 grid size-10 -translate-y-1/2 place-items-center rounded-md text-primer-700 hover:bg-primer-100"
          >
            {visible ? <EyeOff aria-hidden className="size-5" /> : <Eye aria-hidden className="size-5" />}
            <span className="sr-only">Show password</span>
          </button>
        </div>
      )}
    </Field>
  );
}
