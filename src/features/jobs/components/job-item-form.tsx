import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { AREA_UNIT_LABELS, AREA_UNITS, SUBSTRATE_LABELS, SUBSTRATES } from "@shared/domain/substrates";
import { createJobItemInputSchema } from "@shared/schemas/job-item.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { EnumOptions } from "@/components/ui/form/enum-options";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";

type ItemFormInput = z.input<typeof createJobItemInputSchema>;
export type ItemFormValues = z.output<typeof createJobItemInputSchema>;

const FIELDS = ["name", "substrate", "surfaceArea", "areaUnit", "notes"] as const;

/** One part to paint: its name, what it is made of, and its surface area. */
export function JobItemForm({
  defaultValues,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  defaultValues?: Partial<ItemFormInput>;
  submitLabel: string;
  onSubmit: (values: ItemFormValues) => Promise<unknown>;
  onCancel: () => void;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<ItemFormInput, unknown, ItemFormValues>({
    resolver: zodResolver(createJobItemInputSchema),
    defaultValues: { name: "", substrate: "steel", surfaceArea: "", areaUnit: "m2", notes: "", ...defaultValues },
  });

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await onSubmit(values);
    } catch (error) {
      setProblem(applyServerErrors(error, setError, FIELDS));
    }
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <TextField label="Item name" required placeholder="e.g. Fuel tank" error={errors.name?.message} {...register("name")} />
      <SelectField label="Substrate" required error={errors.substrate?.message} {...register("substrate")}>
        {SUBSTRATES.map((s) => (
          <option key={s} value={s}>
            {SUBSTRATE_LABELS[s]}
          </option>
        ))}
      </SelectField>
      <div className="grid grid-cols-[1fr_8rem] gap-3">
        <TextField
          label="Surface area"
          required
          type="number"
          inputMode="decimal"
          step="any"
          min="0"
          error={errors.surfaceArea?.message}
          {...register("surfaceArea")}
        />
        <SelectField label="Unit" required error={errors.areaUnit?.message} {...register("areaUnit")}>
          <EnumOptions values={AREA_UNITS} labels={AREA_UNIT_LABELS} />
        </SelectField>
      </div>
      <TextareaField label="Item notes" rows={3} error={errors.notes?.message} {...register("notes")} />
      <FormActions>
        <Button type="submit" size="lg" pending={isSubmitting}>
          {submitLabel}
        </Button>
        <Button variant="ghost" size="lg" onClick={onCancel}>
          Cancel
        </Button>
      </FormActions>
    </form>
  );
}
