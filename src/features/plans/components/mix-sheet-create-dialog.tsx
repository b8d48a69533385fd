import { useMemo, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { computeMix, MASS_UNITS, MixError, VOLUME_UNITS, type MeasuringUnit, type MixResult, type VolumeUnit } from "@shared/mix/index";
import { toMixComponents } from "@shared/domain/layer-mix";
import { createMixSheetInputSchema, type CreateMixSheetInput } from "@shared/schemas/mix-sheet.schema";
import type { PlanLayerDto } from "@shared/schemas/plan.schema";
import { useQuery } from "@tanstack/react-query";
import { shopSettingsQueries } from "@/lib/shop-settings.queries";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { SingleChoice } from "@/components/ui/choice-group";
import { Dialog } from "@/components/ui/dialog";
import { FormActions } from "@/components/ui/form/form-actions";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { SafetyCautions } from "@/components/ui/safety-cautions";
import { MixPreview } from "./mix-preview";
import { mixWords } from "./plan-layers-view";

const FIELDS = ["mode", "amount", "unit", "knownLabel", "weigh", "roundingStep", "roundingUnit", "layerId"] as const;
const ENGINE_FIELD: Record<string, (typeof FIELDS)[number]> = { knownName: "knownLabel", amount: "amount", total: "amount", unit: "unit", step: "roundingStep", densityGPerMl: "weigh" };

type FormInput = z.input<typeof createMixSheetInputSchema>;
type FormOutput = z.output<typeof createMixSheetInputSchema>;

/** Make a batch for one layer: the amounts are worked out in the browser as you type (same engine as the server). */
export function MixSheetCreateDialog({
  jobId,
  layer,
  defaultUnit = "mL",
  onClose,
  onCreate,
}: {
  jobId: number;
  layer: PlanLayerDto;
  defaultUnit?: VolumeUnit;
  onClose: () => void;
  onCreate: (input: CreateMixSheetInput) => Promise<unknown>;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const hasDensities = layer.components.every((c) => c.densityGPerMl != null);
  const {
    register,
    handleSubmit,
    setError,
    control,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(createMixSheetInputSchema),
    defaultValues: { jobId, layerId: layer.id, mode: "total", amount: "", unit: defaultUnit, knownLabel: layer.components[0]?.label ?? "", weigh: false, roundingStep: "", roundingUnit: defaultUnit },
  });
  const v = useWatch({ control });

  const tolerancePct = useQuery(shopSettingsQueries.public()).data?.ratioTolerancePct;
  const keep = useMemo(() => layer.components.filter((c) => c.category === "hardener").map((c) => c.label), [layer.components]);
  const preview = useMemo((): { result: MixResult | null; error: { field: string; message: string } | null } => {
    const amount = Number(v.amount);
    if (!v.amount || !Number.isFinite(amount) || amount <= 0) return { result: null, error: null };
    const step = v.roundingStep === "" || v.roundingStep == null ? null : Number(v.roundingStep);
    try {
      const result = computeMix({
        components: toMixComponents(layer.components, true),
        mode: v.mode === "component" ? "component" : "total",
        amount,
        unit: (v.unit ?? "mL") as VolumeUnit,
        knownName: v.mode === "component" ? (v.knownLabel ?? undefined) : undefined,
        rounding: step && step > 0 ? { step, unit: ((v.roundingUnit as MeasuringUnit) ?? (v.weigh ? "g" : v.unit)) as MeasuringUnit, tolerancePct, keep } : undefined,
      });
      return { result, error: null };
    } catch (e) {
      if (e instanceof MixError) return { result: null, error: { field: ENGINE_FIELD[e.field ?? ""] ?? "amount", message: e.message } };
      throw e;
    }
  }, [v.amount, v.mode, v.unit, v.knownLabel, v.roundingStep, v.roundingUnit, v.weigh, layer.components, tolerancePct, keep]);

  const fieldError = (name: (typeof FIELDS)[number]) => errors[name]?.message ?? (preview.error?.field === name ? preview.error.message : undefined);
  const labels = Object.fromEntries(layer.components.map((c) => [c.label, `${c.materialCode} ${c.materialName}`]));

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await onCreate({ ...values, roundingUnit: values.roundingStep != null ? values.roundingUnit : null });
    } catch (error) {
      setProblem(applyServerErrors(error, setError, FIELDS));
    }
  });

  return (
    <Dialog title={`Mix sheet: ${layer.name}`} description={mixWords(layer)} onClose={onClose} size="lg">
      <form onSubmit={submit} noValidate className="flex flex-col gap-5">
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <SingleChoice
          label="How much"
          value={(v.mode as "total" | "component") ?? "total"}
          onChange={(mode) => setValue("mode", mode, { shouldValidate: false })}
          options={[
            { value: "total", label: "Make a set amount" },
            { value: "component", label: "Scale to what is on hand" },
          ]}
        />
        <div className="grid gap-4 sm:grid-cols-3">
          {v.mode === "component" ? (
            <SelectField label="Which component" error={fieldError("knownLabel")} {...register("knownLabel")}>
              {layer.components.map((c) => (
                <option key={c.id} value={c.label}>
                  {c.label}
                </option>
              ))}
            </SelectField>
          ) : null}
          <TextField label={v.mode === "component" ? "Amount on hand" : "Batch size"} inputMode="decimal" autoComplete="off" error={fieldError("amount")} {...register("amount")} />
          <SelectField label="Unit" error={fieldError("unit")} {...register("unit")}>
            {VOLUME_UNITS.map((u) => (
              <option key={u.value} value={u.value}>
                {u.label}
              </option>
            ))}
          </SelectField>
        </div>
        <div className="grid gap-4 sm:grid-cols-3">
          <label className="flex min-h-11 cursor-pointer items-center gap-3 self-end text-base">
            <input
              type="checkbox"
              className="size-5 accent-candy-600"
              disabled={!hasDensities}
              {...register("weigh", { onChange: (e) => setValue("roundingUnit", e.target.checked ? "g" : (v.unit ?? "mL")) })}
            />
            Weigh on a scale
          </label>
          <TextField label="Round to a step of" inputMode="decimal" hint="What the cup or scale shows; empty for exact" error={fieldError("roundingStep")} {...register("roundingStep")} />
          <SelectField label="Step unit" error={fieldError("roundingUnit")} {...register("roundingUnit")}>
            {[...VOLUME_UNITS, ...(hasDensities ? MASS_UNITS : [])].map((u) => (
              <option key={u.value} value={u.value}>
                {u.label}
              </option>
            ))}
          </SelectField>
        </div>
        {fieldError("weigh") ? <p className="text-sm font-medium text-red-800">{fieldError("weigh")}</p> : null}
        {!hasDensities ? <p className="text-sm text-primer-700">A material here has no density in the catalogue, so this batch cannot be weighed.</p> : null}
        {preview.result ? <MixPreview result={preview.result} labels={labels} caption="Batch preview" /> : <p className="text-sm text-primer-700">Enter an amount to see the batch.</p>}
        <SafetyCautions cautions={layer.cautions} compact />
        <FormActions>
          <Button type="submit" size="lg" pending={isSubmitting}>
            Make mix sheet
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Cancel
          </Button>
        </FormActions>
      </form>
    </Dialog>
  );
}
