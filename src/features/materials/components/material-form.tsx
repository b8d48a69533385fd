import { useState, type ComponentProps } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { MATERIAL_CATEGORIES, MATERIAL_CATEGORY_LABELS, PURCHASE_UNITS } from "@shared/domain/materials";
import { PURCHASE_UNIT_NAMES } from "@shared/domain/material-units";
import { materialFormSchema, type MaterialFormInput, type MaterialFormValues } from "@shared/schemas/material.schema";
import type { CreateMaterialInput } from "@shared/schemas/material.schema";
import { isApiError } from "@/lib/api-client";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";

const FIELDS = [
  "code",
  "name",
  "category",
  "purchaseUnit",
  "cost",
  "volumeSolidsPct",
  "vocGPerL",
  "waterExemptPct",
  "densityGPerMl",
  "potLifeMinutes",
  "inductionMinutes",
  "recoatMinMinutes",
  "recoatMaxMinutes",
  "containsIsocyanates",
  "flammable",
  "lowStockThreshold",
  "notes",
  "active",
] as const;

/** The catalogue entry form. Figures come from the maker's data sheets; this app never supplies them. */
export function MaterialForm({
  defaultValues,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  defaultValues?: Partial<MaterialFormInput>;
  submitLabel: string;
  onSubmit: (values: CreateMaterialInput) => Promise<unknown>;
  onCancel?: () => void;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<MaterialFormInput, unknown, MaterialFormValues>({
    resolver: zodResolver(materialFormSchema),
    defaultValues: { code: "", name: "", category: "clear", purchaseUnit: "quart", cost: "", active: true, containsIsocyanates: false, flammable: false, ...defaultValues },
  });

  const submit = handleSubmit(async ({ cost, ...values }) => {
    setProblem(null);
    try {
      await onSubmit({ ...values, costCents: cost });
    } catch (error) {
      // The API names the cost "costCents"; the form calls it "cost".
      if (isApiError(error) && error.fields.costCents) error.fields.cost = error.fields.costCents;
      setProblem(applyServerErrors(error, setError, FIELDS));
    }
  });

  const num = (name: (typeof FIELDS)[number]) => ({ inputMode: "decimal" as const, autoComplete: "off", ...register(name as "vocGPerL") });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <div className="grid gap-5 sm:grid-cols-[10rem_1fr]">
        <TextField label="Shop code" required hint="Your own stock number, e.g. S2-B02 (shelf 2, bin 2)" className="uppercase" autoComplete="off" error={errors.code?.message} {...register("code")} />
        <TextField label="Name" required autoComplete="off" error={errors.name?.message} {...register("name")} />
      </div>
      <div className="grid gap-5 sm:grid-cols-3">
        <SelectField label="Category" required error={errors.category?.message} {...register("category")}>
          {MATERIAL_CATEGORIES.map((c) => (
            <option key={c} value={c}>
              {MATERIAL_CATEGORY_LABELS[c]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Bought by the" required error={errors.purchaseUnit?.message} {...register("purchaseUnit")}>
          {PURCHASE_UNITS.map((u) => (
            <option key={u} value={u}>
              {PURCHASE_UNIT_NAMES[u]}
            </option>
          ))}
        </SelectField>
        <TextField label="Cost per unit ($)" required inputMode="decimal" autoComplete="off" placeholder="0.00" error={errors.cost?.message} {...register("cost")} />
      </div>
      <fieldset className="grid gap-5 rounded-xl border border-primer-200 p-4 sm:grid-cols-3">
        <legend className="px-1 text-sm font-semibold text-ink-950">From the technical data sheet</legend>
        <TextField label="Volume solids (%)" {...num("volumeSolidsPct")} error={errors.volumeSolidsPct?.message} />
        <TextField label="VOC (g/L, less water and exempt)" {...num("vocGPerL")} error={errors.vocGPerL?.message} />
        <TextField label="Water and exempt (% by volume)" {...num("waterExemptPct")} error={errors.waterExemptPct?.message} />
        <TextField label="Density (g/mL)" hint="Needed to weigh on a scale" {...num("densityGPerMl")} error={errors.densityGPerMl?.message} />
        <TextField label="Pot life (minutes)" hint="Catalysed products only" {...num("potLifeMinutes")} inputMode="numeric" error={errors.potLifeMinutes?.message} />
        <TextField label="Induction after mixing (minutes)" hint="How long a mixed batch stands before spraying" {...num("inductionMinutes")} inputMode="numeric" error={errors.inductionMinutes?.message} />
        <TextField label="Recoat no sooner than (minutes)" hint="After the last coat, before the next layer" {...num("recoatMinMinutes")} inputMode="numeric" error={errors.recoatMinMinutes?.message} />
        <TextField label="Recoat no later than (minutes)" hint="Past this, see the data sheet (often scuff first)" {...num("recoatMaxMinutes")} inputMode="numeric" error={errors.recoatMaxMinutes?.message} />
        <TextField label="Low-stock level (purchase units)" {...num("lowStockThreshold")} error={errors.lowStockThreshold?.message} />
      </fieldset>
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-sm font-semibold text-ink-950">Hazards (drive the safety cautions)</legend>
        <Check label="Contains isocyanates (2K hardener or activated clear)" {...register("containsIsocyanates")} />
        <Check label="Flammable solvent" {...register("flammable")} />
        <Check label="Active (untick to retire it from new plans)" {...register("active")} />
      </fieldset>
      <TextareaField label="Notes" rows={3} error={errors.notes?.message} {...register("notes")} />
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

function Check({ label, ...input }: ComponentProps<"input"> & { label: string }) {
  return (
    <label className="flex min-h-11 cursor-pointer items-center gap-3 text-base text-ink-950">
      <input type="checkbox" className="size-5 accent-candy-600" {...input} />
      {label}
    </label>
  );
}
