import { useState } from "react";
import { Controller, useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { createJobInputSchema } from "@shared/schemas/job.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { SearchPicker, type PickerQueryFor } from "@/components/ui/form/search-picker";
import { SelectField } from "@/components/ui/form/select-field";
import type { QueryKey } from "@tanstack/react-query";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { emptyToNull } from "@/lib/form-values";

type JobFormInput = z.input<typeof createJobInputSchema>;
export type JobFormValues = z.output<typeof createJobInputSchema>;
type Option<Id> = { id: Id; name: string };

const FIELDS = ["customerId", "title", "dueDate", "assignedPainterId", "notes"] as const;

/** Create or edit a job's basics. The shared schema checks it here and again on the server. */
export function JobForm<K extends QueryKey>({
  customerSearch,
  customerName = null,
  painters,
  defaultValues,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  /** The customer search behind the pick list (typing searches on the server). */
  customerSearch: PickerQueryFor<K>;
  /** The name of the customer in `defaultValues.customerId`, if any. */
  customerName?: string | null;
  painters: Option<string>[];
  defaultValues?: Partial<JobFormInput>;
  submitLabel: string;
  /** Rejects with the API error on failure; the form shows it. */
  onSubmit: (values: JobFormValues) => Promise<unknown>;
  onCancel?: () => void;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const [chosenName, setChosenName] = useState<string | null>(customerName);
  const {
    register,
    control,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<JobFormInput, unknown, JobFormValues>({
    resolver: zodResolver(createJobInputSchema),
    defaultValues: { customerId: "", title: "", dueDate: null, assignedPainterId: null, notes: "", ...defaultValues },
  });

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await onSubmit(values);
    } catch (error) {
      setProblem(applyServerErrors(error, setError, FIELDS));
    }
  });

  const customerChosen = Boolean(watch("customerId"));
  const customerError = errors.customerId ? (customerChosen ? errors.customerId.message : "Choose the customer") : undefined;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <Controller
        control={control}
        name="customerId"
        render={({ field }) => (
          <SearchPicker
            label="Customer"
            required
            noun="customers"
            placeholder="Type a name, e-mail or phone…"
            value={field.value == null ? "" : String(field.value)}
            valueName={chosenName}
            onChange={(id, name) => {
              setChosenName(name);
              field.onChange(id);
            }}
            queryFor={customerSearch}
            error={customerError}
          />
        )}
      />
      <TextField
        label="Title"
        required
        placeholder="e.g. Tank and fenders, candy cobalt over silver"
        error={errors.title?.message}
        {...register("title")}
      />
      <div className="grid gap-5 sm:grid-cols-2">
        <TextField label="Due date" type="date" error={errors.dueDate?.message} {...register("dueDate", { setValueAs: emptyToNull })} />
        <SelectField label="Painter" error={errors.assignedPainterId?.message} {...register("assignedPainterId", { setValueAs: emptyToNull })}>
          <option value="">Not assigned yet</option>
          {painters.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </SelectField>
      </div>
      <TextareaField
        label="Notes"
        rows={4}
        hint="Shop-only: customers never see these."
        error={errors.notes?.message}
        {...register("notes")}
      />
      <FormActions>
        <Button type="submit" size="lg" pending={isSubmitting}>
          {submitLabel}
        </Button>
        {onCancel ? (
          <Button variant="ghost" size="lg" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </FormActions>
    </form>
  );
}
