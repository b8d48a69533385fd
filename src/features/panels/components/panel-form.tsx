import { switchTemperatureText, type TempUnit } from "@shared/domain/booth";
import { useState, type ChangeEvent } from "react";
import { useQuery } from "@tanstack/react-query";
import { useFieldArray, useForm, type UseFormRegister } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { createPanelInputSchema } from "@shared/schemas/panel.schema";
import { DEFAULT_ILLUMINANT, ILLUMINANTS, PANEL_LIGHT_LABELS, type PanelLight } from "@shared/domain/spray-setup";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { SelectField } from "@/components/ui/form/select-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { TextField } from "@/components/ui/form/text-field";
import { materialQueries } from "@/features/materials/api/materials.queries";
import { gunQueries } from "@/features/guns/api/guns.queries";
import { planQueries } from "@/features/plans/api/plans.queries";
import { mixSheetQueries } from "@/features/plans/api/mix-sheets.queries";

type PanelInput = z.input<typeof createPanelInputSchema>;
export type PanelValues = z.output<typeof createPanelInputSchema>;
const FIELDS = [
  "groundName",
  "groundMaterialId",
  "candyName",
  "letDownClear",
  "letDownToner",
  "coats",
  "labL",
  "labA",
  "labB",
  "sprayedOn",
  "notes",
  "jobId",
  "planLayerId",
  "mixSheetId",
  "gunId",
  "tipMm",
  "inletPressure",
  "pressureUnit",
  "distance",
  "fanWidth",
  "distanceUnit",
  "overlapPct",
  "boothTemp",
  "tempUnit",
  "humidityPct",
  "readings",
] as const;

/** The lights other than daylight that a panel can be read under (the main reading is daylight, D65). */
const OTHER_LIGHTS: PanelLight[] = ["booth", "warm_indoor"];

/**
 * How a test panel was made: the ground (from the catalogue), the let-down and coats, the gun set-up and the booth,
 * the plan layer and batch it was sprayed from (for a job's panel), and colour-meter readings under each light.
 */
export function PanelForm({
  defaultValues,
  grounds,
  candies,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  defaultValues?: Partial<PanelInput>;
  grounds: string[];
  candies: string[];
  submitLabel: string;
  onSubmit: (values: PanelValues) => Promise<unknown>;
  onCancel: () => void;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    getValues,
    control,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<PanelInput, unknown, PanelValues>({
    resolver: zodResolver(createPanelInputSchema),
    defaultValues: {
      groundName: "",
      groundMaterialId: "",
      candyName: "",
      letDownClear: "6",
      letDownToner: "1",
      coats: "4",
      labL: "",
      labA: "",
      labB: "",
      sprayedOn: "",
      notes: "",
      gunId: "",
      tipMm: "",
      inletPressure: "",
      pressureUnit: "psi",
      distance: "",
      fanWidth: "",
      distanceUnit: "in",
      overlapPct: "",
      boothTemp: "",
      tempUnit: "F",
      humidityPct: "",
      readings: [],
      ...defaultValues,
    } as Partial<PanelInput>,
  });
  const readings = useFieldArray({ control, name: "readings" as never });
  const groundCatalogue = useQuery(materialQueries.list({ category: "ground_coat" }));
  const guns = useQuery(gunQueries.list());
  const jobId = Number(watch("jobId")) || null;
  const jobPlan = useQuery({ ...planQueries.jobPlan(jobId ?? 0), enabled: jobId != null });
  const sheets = useQuery({ ...mixSheetQueries.forJob(jobId ?? 0), enabled: jobId != null });
  const layerId = Number(watch("planLayerId")) || null;
  const pickedGround = watch("groundMaterialId");
  const usedLights = new Set((watch("readings") as { light: PanelLight }[] | undefined)?.map((r) => r.light));

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await onSubmit(values);
    } catch (error) {
      setProblem(applyServerErrors(error, setError, FIELDS));
    }
  });
  const fieldError = (name: string) => (errors as Record<string, { message?: string } | undefined>)[name]?.message;
  const reg = register as unknown as UseFormRegister<Record<string, string>>;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Ground coat (catalogue)" error={fieldError("groundMaterialId")} {...reg("groundMaterialId")}>
          <option value="">Not in the catalogue: name it</option>
          {(groundCatalogue.data ?? []).map((m) => (
            <option key={m.id} value={m.id}>
              {m.code} {m.name}
            </option>
          ))}
        </SelectField>
        {pickedGround ? null : (
          <TextField label="Ground coat name" list="panel-grounds" placeholder="e.g. a ground mixed for this job" error={fieldError("groundName")} {...reg("groundName")} />
        )}
        <TextField label="Candy" required list="panel-candies" placeholder="e.g. Apple red" error={fieldError("candyName")} {...reg("candyName")} />
      </div>
      <datalist id="panel-grounds">{grounds.map((g) => <option key={g} value={g} />)}</datalist>
      <datalist id="panel-candies">{candies.map((c) => <option key={c} value={c} />)}</datalist>
      <fieldset className="grid grid-cols-[1fr_1fr_1fr] gap-3">
        <legend className="mb-1.5 text-sm font-semibold text-ink-950">Let-down (clear : toner) and coats</legend>
        <TextField label="Clear parts" required inputMode="decimal" error={fieldError("letDownClear")} {...reg("letDownClear")} />
        <TextField label="Toner parts" required inputMode="decimal" error={fieldError("letDownToner")} {...reg("letDownToner")} />
        <TextField label="Coats" required inputMode="numeric" error={fieldError("coats")} {...reg("coats")} />
      </fieldset>

      {jobId ? (
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="mb-1.5 text-sm font-semibold text-ink-950">Sprayed from (this job&apos;s plan)</legend>
          <SelectField label="Plan layer" error={fieldError("planLayerId")} {...reg("planLayerId")}>
            <option value="">Not linked</option>
            {(jobPlan.data?.plan?.latest.layers ?? []).map((l) => (
              <option key={l.id} value={l.id}>
                {l.position + 1}. {l.name}
              </option>
            ))}
          </SelectField>
          <SelectField label="Batch (mix sheet)" error={fieldError("mixSheetId")} {...reg("mixSheetId")}>
            <option value="">Not linked</option>
            {(sheets.data ?? [])
              .filter((sh) => sh.status === "mixed" && (layerId == null || sh.layerId === layerId))
              .map((sh) => (
                <option key={sh.id} value={sh.id}>
                  #{sh.id} {sh.layerName}, {sh.total} {sh.unit}
                </option>
              ))}
          </SelectField>
        </fieldset>
      ) : null}

      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="mb-1.5 text-sm font-semibold text-ink-950">Spray set-up</legend>
        <SelectField label="Gun" error={fieldError("gunId")} {...reg("gunId")}>
          <option value="">Not recorded</option>
          {(guns.data ?? []).filter((g) => g.active).map((g) => (
            <option key={g.id} value={g.id}>
              {g.name}
            </option>
          ))}
        </SelectField>
        <TextField label="Tip (mm)" inputMode="decimal" error={fieldError("tipMm")} {...reg("tipMm")} />
        <TextField label="Overlap (%)" inputMode="decimal" error={fieldError("overlapPct")} {...reg("overlapPct")} />
        <TextField label="Inlet pressure" inputMode="decimal" error={fieldError("inletPressure")} {...reg("inletPressure")} />
        <SelectField label="Pressure unit" error={fieldError("pressureUnit")} {...reg("pressureUnit")}>
          <option value="psi">psi</option>
          <option value="bar">bar</option>
        </SelectField>
        <span className="hidden sm:block" />
        <TextField label="Distance from the part" inputMode="decimal" error={fieldError("distance")} {...reg("distance")} />
        <TextField label="Fan width" inputMode="decimal" error={fieldError("fanWidth")} {...reg("fanWidth")} />
        <SelectField label="Length unit" error={fieldError("distanceUnit")} {...reg("distanceUnit")}>
          <option value="in">in</option>
          <option value="cm">cm</option>
        </SelectField>
        <TextField label="Booth temperature" inputMode="decimal" error={fieldError("boothTemp")} {...reg("boothTemp")} />
        <SelectField
          label="Temperature unit"
          error={fieldError("tempUnit")}
          {...reg("tempUnit", {
            onChange: (e: ChangeEvent<HTMLSelectElement>) => {
              const to = e.target.value as TempUnit;
              setValue("boothTemp", switchTemperatureText(String(getValues("boothTemp") ?? ""), to === "C" ? "F" : "C", to));
            },
          })}
        >
          <option value="F">°F</option>
          <option value="C">°C</option>
        </SelectField>
        <TextField label="Humidity (%)" inputMode="decimal" error={fieldError("humidityPct")} {...reg("humidityPct")} />
      </fieldset>

      <fieldset className="grid grid-cols-3 gap-3">
        <legend className="mb-1.5 text-sm font-semibold text-ink-950">Colour-meter reading in daylight, D65 (optional, all three or none)</legend>
        <TextField label="L*" inputMode="decimal" error={fieldError("labL")} {...reg("labL")} />
        <TextField label="a*" inputMode="decimal" error={fieldError("labA")} {...reg("labA")} />
        <TextField label="b*" inputMode="decimal" error={fieldError("labB")} {...reg("labB")} />
      </fieldset>
      {readings.fields.map((f, i) => {
        const light = ((watch("readings") as { light: PanelLight }[] | undefined)?.[i]?.light) ?? "booth";
        return (
          <fieldset key={f.id} className="grid grid-cols-2 gap-3 sm:grid-cols-[1fr_1fr_1fr_1fr_auto]">
            <legend className="mb-1.5 text-sm font-semibold text-ink-950">Reading under {PANEL_LIGHT_LABELS[light].toLowerCase()}</legend>
            <SelectField label="Illuminant" {...reg(`readings.${i}.illuminant`)}>
              {ILLUMINANTS.map((il) => (
                <option key={il} value={il}>
                  {il}
                </option>
              ))}
            </SelectField>
            <TextField label="L*" inputMode="decimal" error={fieldError(`readings.${i}.labL`)} {...reg(`readings.${i}.labL`)} />
            <TextField label="a*" inputMode="decimal" error={fieldError(`readings.${i}.labA`)} {...reg(`readings.${i}.labA`)} />
            <TextField label="b*" inputMode="decimal" error={fieldError(`readings.${i}.labB`)} {...reg(`readings.${i}.labB`)} />
            <Button variant="ghost" className="self-end" onClick={() => readings.remove(i)}>
              Remove<span className="sr-only"> the {PANEL_LIGHT_LABELS[light].toLowerCase()} reading</span>
            </Button>
          </fieldset>
        );
      })}
      {OTHER_LIGHTS.some((l) => !usedLights.has(l)) ? (
        <div className="flex flex-wrap gap-2">
          {OTHER_LIGHTS.filter((l) => !usedLights.has(l)).map((l) => (
            <Button key={l} variant="secondary" onClick={() => readings.append({ light: l, illuminant: DEFAULT_ILLUMINANT[l], labL: "", labA: "", labB: "" } as never)}>
              + Reading under {PANEL_LIGHT_LABELS[l].toLowerCase()}
            </Button>
          ))}
        </div>
      ) : null}

      <TextField label="Sprayed on" type="date" error={fieldError("sprayedOn")} fieldClassName="max-w-xs" {...reg("sprayedOn")} />
      <TextareaField label="Notes" rows={3} error={fieldError("notes")} {...reg("notes")} />
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
