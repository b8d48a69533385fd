import { COLOUR_SIGN_OFF_RULE } from "@shared/domain/colour-sign-off";
import { useState, type ChangeEvent, type ComponentProps, type ReactNode } from "react";
import { Controller, useFieldArray, useForm, type Path } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { Plus, Trash2 } from "lucide-react";
import { LAYER_KIND_LABELS, LAYER_KINDS } from "@shared/domain/layers";
import { AREA_UNIT_LABELS, AREA_UNITS } from "@shared/domain/substrates";
import { FILM_UNIT_LABELS, FILM_UNITS, PRESSURE_UNIT_LABELS, PRESSURE_UNITS, SCALE_UNITS, UNIT_PRESETS, type UnitSystem } from "@shared/domain/measures";
import { VOLUME_UNITS } from "@shared/mix/index";
import { TAXABLE_LINE_KINDS, updateShopSettingsSchema, type ShopSettings } from "@shared/schemas/settings.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { MoneyField } from "@/components/ui/form/money-field";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { controlClasses } from "@/components/ui/form/field";
import { WasteAllowanceFields } from "./waste-allowance-fields";
import { emptyToNull } from "@/lib/form-values";

type SettingsInput = z.input<typeof updateShopSettingsSchema>;
type SettingsOutput = z.output<typeof updateShopSettingsSchema>;

const TAX_KIND_LABELS: Record<(typeof TAXABLE_LINE_KINDS)[number], string> = {
  labour: "Labour",
  materials: "Materials",
  supplies: "Shop supplies",
  sublet: "Outside work",
};

const TOP_FIELDS = [
  "shopName",
  "shopAddress",
  "shopPhone",
  "shopEmail",
  "labourRateCents",
  "taxPercent",
  "taxAppliesTo",
  "depositPercent",
  "materialsMarkupPercent",
  "shopSuppliesPercent",
  "quoteValidDays",
  "quoteTerms",
  "defaultVolumeUnit",
  "defaultAreaUnit",
  "deltaEMatch",
  "deltaEClose",
  "vocLimits",
  "wasteAllowances",
  "minimumBatchMl",
  "vocMonthlyCapKg",
  "vocYearlyCapKg",
  "lowDiskWarningGb",
  "requireColourSignOff",
  "ratioTolerancePct",
  "unitSystem",
  "filmUnit",
  "pressureUnit",
  "tempUnit",
  "massUnit",
] as const;

/** "" → null for the optional caps (an empty box means "no cap"). */

function Group({ title, description, children }: { title: string; description?: ReactNode; children: ReactNode }) {
  return (
    <fieldset className="rounded-xl border border-primer-200 bg-white p-4 shadow-card sm:p-5">
      <legend className="float-left mb-1 w-full text-lg font-semibold text-ink-950">{title}</legend>
      {description ? <div className="clear-both mb-4 max-w-prose text-sm text-primer-700">{description}</div> : <div className="clear-both mb-3" />}
      <div className="flex flex-col gap-5">{children}</div>
    </fieldset>
  );
}

/** The shop's settings. The owner edits; anyone else who may see them gets the same form, read-only. */
export function SettingsForm({
  settings,
  canEdit,
  onSubmit,
  limitsNote,
}: {
  settings: ShopSettings;
  canEdit: boolean;
  onSubmit: (values: SettingsOutput) => Promise<unknown>;
  /** The "limits are yours to enter" words, shown above the VOC limits. */
  limitsNote: ReactNode;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    setValue,
    control,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<SettingsInput, unknown, SettingsOutput>({
    resolver: zodResolver(updateShopSettingsSchema),
    defaultValues: settings,
  });
  const limits = useFieldArray({ control, name: "vocLimits" });

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      const saved = await onSubmit(values);
      reset(saved as ShopSettings);
    } catch (error) {
      const paths = [...TOP_FIELDS, ...limits.fields.flatMap((_, i) => [`vocLimits.${i}.layerKind`, `vocLimits.${i}.limitGPerL`])] as Path<SettingsInput>[];
      setProblem(applyServerErrors(error, setError, paths));
    }
  });

  const limitErrors = errors.vocLimits;
  const usedKinds = new Set(limits.fields.map((f) => f.layerKind));

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-6">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <fieldset disabled={!canEdit} className="flex min-w-0 flex-col gap-6">
        <legend className="sr-only">Shop settings</legend>
        <Group title="Shop details" description="Printed on quotes and shown in the customer portal.">
          <TextField label="Shop name" required autoComplete="organization" error={errors.shopName?.message} {...register("shopName")} />
          <TextareaField label="Address" rows={2} error={errors.shopAddress?.message} {...register("shopAddress")} />
          <div className="grid gap-5 sm:grid-cols-2">
            <TextField label="Phone" type="tel" inputMode="tel" error={errors.shopPhone?.message} {...register("shopPhone")} />
            <TextField label="Email" type="email" inputMode="email" error={errors.shopEmail?.message} {...register("shopEmail")} />
          </div>
        </Group>

        <Group title="Rates and quotes" description="New quotes start from these; a quote already sent keeps the figures it was sent with.">
          <div className="grid gap-5 sm:grid-cols-2 lg:grid-cols-3">
            <Controller
              control={control}
              name="labourRateCents"
              render={({ field, fieldState }) => (
                <MoneyField label="Labour rate" suffix="/h" required name={field.name} value={field.value as number | string | null} onChange={field.onChange} onBlur={field.onBlur} error={fieldState.error?.message} />
              )}
            />
            <PercentField label="Tax" error={errors.taxPercent?.message} {...register("taxPercent")} />
            <PercentField label="Deposit" error={errors.depositPercent?.message} {...register("depositPercent")} />
            <PercentField label="Materials markup" error={errors.materialsMarkupPercent?.message} {...register("materialsMarkupPercent")} />
            <PercentField label="Shop supplies" hint="Of the materials cost." error={errors.shopSuppliesPercent?.message} {...register("shopSuppliesPercent")} />
            <TextField label="Quote valid for (days)" inputMode="numeric" error={errors.quoteValidDays?.message} {...register("quoteValidDays")} />
          </div>
          <fieldset aria-describedby="tax-kinds-hint">
            <legend className="text-sm font-semibold text-ink-950">Tax applies to</legend>
            <p id="tax-kinds-hint" className="mt-0.5 text-sm text-primer-700">
              Which kinds of quote line are taxed depends on your state; tick the ones yours taxes.
            </p>
            <div className="mt-2 flex flex-wrap gap-2">
              {TAXABLE_LINE_KINDS.map((k) => (
                <label key={k} className="inline-flex min-h-11 cursor-pointer items-center gap-2 rounded-lg border border-primer-300 bg-white px-3 text-sm font-medium has-checked:border-ink-900 has-checked:bg-ink-50">
                  <input type="checkbox" value={k} className="size-5 accent-ink-900" {...register("taxAppliesTo")} />
                  {TAX_KIND_LABELS[k]}
                </label>
              ))}
            </div>
            {errors.taxAppliesTo?.message ? <p className="mt-1 text-sm font-medium text-red-800">{errors.taxAppliesTo.message}</p> : null}
          </fieldset>
          <TextareaField label="Quote terms" rows={4} hint="Printed at the foot of every quote." error={errors.quoteTerms?.message} {...register("quoteTerms")} />
        </Group>

        <Group title="Units and colour matching" description="Every screen shows each measure in the unit chosen here. Picking a system sets them all; any one can then differ.">
          <div className="grid gap-5 sm:grid-cols-2">
            <SelectField
              label="Unit system"
              error={errors.unitSystem?.message}
              {...register("unitSystem", {
                onChange: (e: ChangeEvent<HTMLSelectElement>) => {
                  const preset = UNIT_PRESETS[e.target.value as UnitSystem];
                  if (!preset) return;
                  const opts = { shouldDirty: true };
                  setValue("defaultVolumeUnit", preset.volume, opts);
                  setValue("defaultAreaUnit", preset.area, opts);
                  setValue("filmUnit", preset.film, opts);
                  setValue("pressureUnit", preset.pressure, opts);
                  setValue("tempUnit", preset.temperature, opts);
                  setValue("massUnit", preset.mass, opts);
                },
              })}
            >
              <option value="metric">Metric (mL, m², µm, bar, °C, g)</option>
              <option value="us">US customary (fl oz, ft², mil, psi, °F, oz)</option>
            </SelectField>
            <SelectField label="Film thickness" error={errors.filmUnit?.message} {...register("filmUnit")}>
              {FILM_UNITS.map((u) => (
                <option key={u} value={u}>
                  {FILM_UNIT_LABELS[u]}
                </option>
              ))}
            </SelectField>
            <SelectField label="Gun pressure" error={errors.pressureUnit?.message} {...register("pressureUnit")}>
              {PRESSURE_UNITS.map((u) => (
                <option key={u} value={u}>
                  {PRESSURE_UNIT_LABELS[u]}
                </option>
              ))}
            </SelectField>
            <SelectField label="Booth temperature" error={errors.tempUnit?.message} {...register("tempUnit")}>
              <option value="C">°C</option>
              <option value="F">°F</option>
            </SelectField>
            <SelectField label="Scale" error={errors.massUnit?.message} {...register("massUnit")}>
              {SCALE_UNITS.map((u) => (
                <option key={u} value={u}>
                  {u === "g" ? "grams (g)" : "ounces (oz)"}
                </option>
              ))}
            </SelectField>
            <SelectField label="Default volume unit" error={errors.defaultVolumeUnit?.message} {...register("defaultVolumeUnit")}>
              {VOLUME_UNITS.map((u) => (
                <option key={u.value} value={u.value}>
                  {u.label}
                </option>
              ))}
            </SelectField>
            <SelectField label="Default area unit" error={errors.defaultAreaUnit?.message} {...register("defaultAreaUnit")}>
              {AREA_UNITS.map((u) => (
                <option key={u} value={u}>
                  {AREA_UNIT_LABELS[u]}
                </option>
              ))}
            </SelectField>
            <TextField
              label="Colour tolerance (ΔE00)"
              inputMode="decimal"
              hint="A test panel closer than this to the approved one reads “Within tolerance”."
              error={errors.deltaEMatch?.message}
              {...register("deltaEMatch")}
            />
            <TextField
              label="Outer colour limit (ΔE00)"
              inputMode="decimal"
              hint="Over the tolerance but closer than this reads “Borderline”; this far or further reads “Out of tolerance”."
              error={errors.deltaEClose?.message}
              {...register("deltaEClose")}
            />
            <TextField
              label="Ratio tolerance when rounding a mix (%)"
              inputMode="decimal"
              hint="Mix sheets name every component whose ratio moves more than this when amounts are rounded to the cup or scale step."
              error={errors.ratioTolerancePct?.message}
              {...register("ratioTolerancePct")}
            />
          </div>
          <label className="flex min-h-12 items-start gap-3 text-sm text-ink-950">
            <input type="checkbox" className="mt-0.5 size-5 accent-ink-900" {...register("requireColourSignOff")} />
            <span>
              <span className="font-semibold">{COLOUR_SIGN_OFF_RULE}</span>
              <span className="block text-primer-700">The booth takes no ground, candy or effect coat until the customer has approved a test panel in the portal.</span>
            </span>
          </label>
        </Group>

        <Group title="VOC limits and caps" description={limitsNote}>
          {typeof limitErrors?.message === "string" ? <p className="text-sm font-medium text-red-800">{limitErrors.message}</p> : null}
          {limits.fields.length === 0 ? <p className="text-sm text-primer-700">No limits entered: no batch is flagged in the VOC log.</p> : null}
          <ul className="flex flex-col gap-3">
            {limits.fields.map((f, i) => {
              const rowErrors = Array.isArray(limitErrors) ? limitErrors[i] : undefined;
              return (
                <li key={f.id} className="grid items-start gap-3 rounded-lg bg-primer-50 p-3 sm:grid-cols-[minmax(0,1fr)_12rem_auto]">
                  <SelectField label={`Coating category ${i + 1}`} error={rowErrors?.layerKind?.message} {...register(`vocLimits.${i}.layerKind`)}>
                    {LAYER_KINDS.map((k) => (
                      <option key={k} value={k}>
                        {LAYER_KIND_LABELS[k]}
                      </option>
                    ))}
                  </SelectField>
                  <div className="flex flex-col gap-1.5">
                    <label htmlFor={`voc-limit-${i}`} className="text-sm font-semibold text-ink-950">
                      Limit {i + 1} (g/L)
                    </label>
                    <input
                      id={`voc-limit-${i}`}
                      inputMode="decimal"
                      aria-invalid={rowErrors?.limitGPerL ? true : undefined}
                      aria-describedby={rowErrors?.limitGPerL ? `voc-limit-${i}-error` : undefined}
                      className={controlClasses}
                      {...register(`vocLimits.${i}.limitGPerL`)}
                    />
                    {rowErrors?.limitGPerL?.message ? (
                      <p id={`voc-limit-${i}-error`} className="text-sm font-medium text-red-800">
                        {rowErrors.limitGPerL.message}
                      </p>
                    ) : null}
                  </div>
                  {canEdit ? (
                    <Button variant="ghost" className="sm:mt-7" onClick={() => limits.remove(i)} icon={<Trash2 aria-hidden className="size-4" />}>
                      Remove<span className="sr-only"> limit {i + 1}</span>
                    </Button>
                  ) : null}
                </li>
              );
            })}
          </ul>
          {canEdit && limits.fields.length < LAYER_KINDS.length ? (
            <div>
              <Button
                variant="secondary"
                onClick={() => limits.append({ layerKind: LAYER_KINDS.find((k) => !usedKinds.has(k)) ?? "clear", limitGPerL: "" as unknown as number })}
                icon={<Plus aria-hidden className="size-4" />}
              >
                Add a limit
              </Button>
            </div>
          ) : null}
          <div className="grid gap-5 sm:grid-cols-2">
            <TextField
              label="Monthly VOC cap (kg)"
              inputMode="decimal"
              hint="Leave empty for no monthly cap."
              error={errors.vocMonthlyCapKg?.message}
              {...register("vocMonthlyCapKg", { setValueAs: emptyToNull })}
            />
            <TextField
              label="Yearly VOC cap (kg)"
              inputMode="decimal"
              hint="Leave empty for no yearly cap."
              error={errors.vocYearlyCapKg?.message}
              {...register("vocYearlyCapKg", { setValueAs: emptyToNull })}
            />
          </div>
        </Group>

        <Group title="Batches" description="Added to the material estimate: paint lost in the cup, the gun and overspray, per layer kind (e.g. 15 %), and the smallest batch worth mixing.">
          <Controller
            control={control}
            name="wasteAllowances"
            render={({ field }) => <WasteAllowanceFields value={field.value as never} onChange={field.onChange} error={errors.wasteAllowances?.message} disabled={!canEdit} />}
          />
          <div className="grid gap-5 sm:grid-cols-2">
            <TextField label="Minimum batch (mL)" inputMode="decimal" hint="An estimated layer needs at least this much. 0 for none." error={errors.minimumBatchMl?.message} {...register("minimumBatchMl")} />
          </div>
        </Group>

        <Group title="Server">
          <div className="grid gap-5 sm:grid-cols-2">
            <TextField
              label="Warn when free disk space is below (GB)"
              inputMode="decimal"
              hint="The dashboard warns when the data folder's disk has less room than this. 0 turns the warning off."
              error={errors.lowDiskWarningGb?.message}
              {...register("lowDiskWarningGb")}
            />
          </div>
        </Group>
      </fieldset>
      {canEdit ? (
        <FormActions className="sticky bottom-0 z-10 -mx-1 rounded-xl border border-primer-200 bg-white/95 px-4 py-3 shadow-raised backdrop-blur">
          <Button type="submit" size="lg" pending={isSubmitting}>
            Save settings
          </Button>
          <Button variant="ghost" size="lg" disabled={!isDirty || isSubmitting} onClick={() => reset()}>
            Undo changes
          </Button>
        </FormActions>
      ) : null}
    </form>
  );
}

function PercentField({ label, hint, error, ...input }: { label: string; hint?: string; error?: string } & Omit<ComponentProps<"input">, "id">) {
  return <TextField label={`${label} (%)`} inputMode="decimal" hint={hint} error={error} {...input} />;
}
