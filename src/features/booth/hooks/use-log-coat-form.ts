import { useRef, useState } from "react";
import type { UseFormSetError } from "react-hook-form";
import type { z } from "zod";
import type { createCoatLogInputSchema } from "@shared/schemas/booth.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { SETUP_FIELD_NAMES, type SetupFields } from "../components/spray-setup-fields";

type LogInput = z.input<typeof createCoatLogInputSchema>;
export type LogValues = z.output<typeof createCoatLogInputSchema>;
/** What the painter can change on the form; job, layer and coat come from the card. */
export type LogFields = { boothTemp: string; tempUnit: "C" | "F"; humidityPct: string; note: string; prepOverrideReason: string; timingOverrideReason: string; changeOverrideReason: string } & SetupFields;
type FieldName = keyof LogFields | "coatNumber";
const FIELDS = ["boothTemp", "tempUnit", "humidityPct", "note", "prepOverrideReason", "timingOverrideReason", "changeOverrideReason", "coatNumber", ...SETUP_FIELD_NAMES] as const;

/**
 * State for the booth's log-a-coat form, checked with the same zod schema as the server. Plain React state instead
 * of react-hook-form: this form is on the first screen of the booth card, and leaving the form library out keeps the
 * tablet's first download small (see the client-weight figure in the README). Other forms use react-hook-form.
 * For the same reason the schema (and zod) load at the first tap, from the service worker's cache when offline.
 */
export function useLogCoatForm(card: { jobId: number; layerId: number; coatNumber: number }, initial: LogFields) {
  const [values, setValues] = useState(initial);
  const [errors, setErrors] = useState<Partial<Record<FieldName, string>>>({});
  const formRef = useRef<HTMLFormElement>(null);

  const focus = (field: string) => formRef.current?.querySelector<HTMLElement>(`[name="${field}"]`)?.focus();

  /** Sets one field and drops its error (the painter is fixing it). */
  const set = <K extends keyof LogFields>(field: K, value: LogFields[K]) => {
    setValues((v) => ({ ...v, [field]: value }));
    setErrors((e) => (e[field] ? { ...e, [field]: undefined } : e));
  };

  /** The parsed values, or null with every field's first problem shown and the first bad field focused. */
  const validate = async (): Promise<LogValues | null> => {
    const { createCoatLogInputSchema } = await import("@shared/schemas/booth.schema");
    const parsed = createCoatLogInputSchema.safeParse({ ...card, ...values });
    if (parsed.success) return parsed.data;
    const found: Partial<Record<FieldName, string>> = {};
    for (const issue of parsed.error.issues) {
      const field = String(issue.path[0] ?? "") as FieldName;
      found[field] ??= issue.message;
    }
    setErrors(found);
    const first = FIELDS.find((f) => found[f]);
    if (first) focus(first);
    return null;
  };

  /** A refused save: the server's field messages go beside their fields; returns the form-level message. */
  const showServerErrors = (error: unknown): string => {
    const setError: UseFormSetError<LogInput> = (name, { message }, options) => {
      setErrors((e) => ({ ...e, [name]: message }));
      if (options?.shouldFocus) focus(name);
    };
    return applyServerErrors(error, setError, FIELDS);
  };

  return { values, errors, set, validate, showServerErrors, formRef };
}
