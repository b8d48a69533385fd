import { useState, type ReactNode } from "react";
import { centsToInput, parseMoneyToCents } from "@shared/quote/index";
import { cn } from "@/utils/cn";
import { controlClasses, Field } from "./field";

/**
 * A dollars-and-cents input whose value is integer cents. People type "95", "1,234.5" or "$19.99"; the value
 * becomes 9500 / 123450 / 1999 (half-up on the typed digits, never through floats). Text that is not an amount
 * is passed on as typed, so the schema reports it beside the field.
 */
export function MoneyField({
  label,
  value,
  onChange,
  onBlur,
  error,
  hint,
  required,
  name,
  fieldClassName,
  className,
  suffix,
}: {
  label: ReactNode;
  value: number | string | null | undefined;
  onChange: (value: number | string | null) => void;
  onBlur?: () => void;
  error?: string;
  hint?: ReactNode;
  required?: boolean;
  name?: string;
  fieldClassName?: string;
  className?: string;
  /** Unit shown after the amount, e.g. "/h". */
  suffix?: string;
}) {
  const [text, setText] = useState(() => (typeof value === "number" ? centsToInput(value) : (value ?? "")));
  // Follow outside changes (form reset, a refill from the plan) unless the field holds the same amount: adjusted
  // while rendering when the value changes, as React's docs advise, rather than in an effect one render late.
  const [seen, setSeen] = useState(value);
  if (seen !== value) {
    setSeen(value);
    if (typeof value === "number" && parseMoneyToCents(text) !== value) setText(centsToInput(value));
    if (value == null && text !== "" && parseMoneyToCents(text) !== null) setText("");
  }
  return (
    <Field label={label} error={error} hint={hint} required={required} className={fieldClassName}>
      {(control) => (
        <div className="relative">
          <span aria-hidden className="pointer-events-none absolute top-1/2 left-3 -translate-y-1/2 text-primer-600">
            $
          </span>
          <input
            {...control}
            name={name}
            inputMode="decimal"
            autoComplete="off"
            value={text}
            onChange={(e) => {
              setText(e.target.value);
              const t = e.target.value.trim();
              onChange(t === "" ? null : (parseMoneyToCents(t) ?? t));
            }}
            onBlur={() => {
              const cents = parseMoneyToCents(text);
              if (cents !== null) setText(centsToInput(cents));
              onBlur?.();
            }}
            className={cn(controlClasses, "pl-7 tabular-nums", suffix && "pr-10", className)}
          />
          {suffix ? (
            <span aria-hidden className="pointer-events-none absolute top-1/2 right-3 -translate-y-1/2 text-sm text-primer-600">
              {suffix}
            </span>
          ) : null}
        </div>
      )}
    </Field>
  );
}
