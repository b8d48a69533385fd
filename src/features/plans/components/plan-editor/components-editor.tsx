import { useMemo } from "react";
import { useFieldArray, useWatch } from "react-hook-form";
import { Plus, Trash2 } from "lucide-react";
import { MATERIAL_CATEGORIES, MATERIAL_CATEGORY_LABELS } from "@shared/domain/materials";
import { cautionsFor } from "@shared/domain/safety";
import { toMixComponents } from "@shared/domain/layer-mix";
import { resolveShares } from "@shared/mix/index";
import { MAX_LAYER_COMPONENTS } from "@shared/schemas/plan.schema";
import type { MaterialDto } from "@shared/schemas/material.schema";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { SafetyCautions } from "@/components/ui/safety-cautions";
import { cn } from "@/utils/cn";
import { formatNumber } from "@/utils/format-quantity";
import { LayerVocNote } from "../layer-voc-note";

import { MIX_NAME_OF_CATEGORY, mixProblemOf, num, uniqueLabel, type EditorComponent } from "./editor-values";
import type { LayerCardProps } from "./layer-card";

export function ComponentsEditor({
  layerIndex,
  control,
  register,
  setValue,
  errors,
  materials,
}: Pick<LayerCardProps, "control" | "register" | "setValue" | "errors" | "materials"> & { layerIndex: number }) {
  const name = `layers.${layerIndex}.components` as const;
  const rows = useFieldArray({ control, name });
  const watched = useWatch({ control, name });
  const values = useMemo(() => watched ?? [], [watched]);
  const byId = useMemo(() => new Map(materials.map((m) => [String(m.id), m])), [materials]);
  const live = mixProblemOf(values);
  const layerErrors = errors.layers?.[layerIndex]?.components;
  const errorFor = (j: number, field: keyof EditorComponent): string | undefined => {
    const own = (layerErrors?.[j] as Record<string, { message?: string }> | undefined)?.[field]?.message;
    if (own) return own;
    if (live && live.path === `components.${j}.${field}`) return live.message;
    return undefined;
  };
  const shares = useMemo(() => {
    if (live || values.length === 0) return null;
    try {
      return resolveShares(
        toMixComponents(
          values.map((c) => ({ label: c.label.trim(), parts: c.mode === "parts" ? num(c.parts) : null, percent: c.mode === "percent" ? num(c.percent) : null, percentOf: c.mode === "percent" ? c.percentOf : null })),
        ),
      );
    } catch {
      return null;
    }
  }, [live, values]);
  const summary = shares?.map((s) => `${s.name} ${formatNumber(s.share * 100, 1)} %`).join(" · ");
  const kind = useWatch({ control, name: `layers.${layerIndex}.kind` });
  const chosen = values.map((c) => byId.get(c.materialId)).filter((m): m is MaterialDto => !!m);
  const cautions = cautionsFor(chosen);

  return (
    <fieldset className="rounded-xl border border-primer-200 bg-primer-50/60 p-3">
      <legend className="px-1 text-sm font-semibold">Mix</legend>
      {values.length === 0 ? <p className="text-sm text-primer-700">No mix (e.g. a prep step). Add components to mix this layer.</p> : null}
      <ul className="flex flex-col gap-3">
        {rows.fields.map((row, j) => {
          const c = values[j];
          const others = values.filter((_, k) => k !== j).map((o) => o.label.trim()).filter(Boolean);
          const rowName = `${name}.${j}` as const;
          return (
            <li key={row.id} className="flex flex-col gap-3 rounded-lg border border-primer-200 bg-white p-3">
              <div className="flex flex-wrap items-start gap-2">
                <SelectField
                  label={`Material ${j + 1}`}
                  fieldClassName="min-w-0 flex-1"
                  error={errorFor(j, "materialId")}
                  {...register(`${rowName}.materialId`, {
                    onChange: (ev) => {
                      const m = byId.get(ev.target.value);
                      if (m && !c?.label) setValue(`${rowName}.label`, uniqueLabel(MIX_NAME_OF_CATEGORY[m.category] ?? "part", others));
                    },
                  })}
                >
                  <option value="">Choose a material…</option>
                  {MATERIAL_CATEGORIES.map((cat) => {
                    const inCat = materials.filter((m) => m.category === cat);
                    return inCat.length ? (
                      <optgroup key={cat} label={MATERIAL_CATEGORY_LABELS[cat]}>
                        {inCat.map((m) => (
                          <option key={m.id} value={m.id}>
                            {m.code} {m.name}
                          </option>
                        ))}
                      </optgroup>
                    ) : null;
                  })}
                </SelectField>
                <TextField label="Name on the mix sheet" fieldClassName="w-40" autoComplete="off" error={errorFor(j, "label")} {...register(`${rowName}.label`)} />
                <Button variant="ghost" size="sm" className="mt-7" onClick={() => rows.remove(j)} aria-label={`Remove material ${j + 1}`} icon={<Trash2 aria-hidden className="size-4" />} />
              </div>
              <div className="grid gap-3 sm:grid-cols-[auto_minmax(0,1fr)] sm:items-start">
                <fieldset className="flex flex-col gap-1.5">
                  <legend className="mb-1.5 text-sm font-semibold">Given as</legend>
                  <div className="flex gap-1">
                    {(["parts", "percent"] as const).map((mode) => (
                      <label key={mode} className={cn("inline-flex min-h-11 cursor-pointer items-center rounded-lg border px-3 text-sm font-semibold", c?.mode === mode ? "border-ink-900 bg-ink-900 text-white" : "border-primer-300 bg-white")}>
                        <input type="radio" value={mode} className="sr-only" {...register(`${rowName}.mode`, { onChange: () => (mode === "parts" ? (setValue(`${rowName}.percent`, ""), setValue(`${rowName}.percentOf`, [])) : setValue(`${rowName}.parts`, "")) })} />
                        {mode === "parts" ? "Parts" : "Percent"}
                      </label>
                    ))}
                  </div>
                </fieldset>
                {c?.mode === "percent" ? (
                  <div className="grid gap-2 sm:grid-cols-[7rem_minmax(0,1fr)]">
                    <TextField label="Percent" inputMode="decimal" error={errorFor(j, "percent")} {...register(`${rowName}.percent`)} />
                    <fieldset className="flex flex-col gap-1">
                      <legend className="mb-1 text-sm font-semibold">of</legend>
                      <div className="flex flex-wrap gap-x-3 gap-y-1">
                        {others.length === 0 ? <span className="text-sm text-primer-700">Label the other components first</span> : null}
                        {others.map((o) => (
                          <label key={o} className="inline-flex min-h-10 items-center gap-2 text-sm">
                            <input
                                type="checkbox"
                                className="size-5 accent-candy-600"
                                checked={(c?.percentOf ?? []).includes(o)}
                                onChange={(ev) => {
                                  const now = (c?.percentOf ?? []).filter((x) => x !== o && others.includes(x));
                                  setValue(`${rowName}.percentOf`, ev.target.checked ? [...now, o] : now, { shouldDirty: true });
                                }}
                              />
                            {o}
                          </label>
                        ))}
                      </div>
                      {errorFor(j, "percentOf") ? <p className="text-sm font-medium text-red-800">{errorFor(j, "percentOf")}</p> : null}
                    </fieldset>
                  </div>
                ) : (
                  <TextField label="Parts" fieldClassName="max-w-40" inputMode="decimal" error={errorFor(j, "parts")} {...register(`${rowName}.parts`)} />
                )}
              </div>
            </li>
          );
        })}
      </ul>
      {live && live.path === "components" ? <p className="mt-2 text-sm font-medium text-red-800">{live.message}</p> : null}
      {summary ? (
        <p className="mt-2 text-sm text-ink-900">
          <span className="font-semibold">Shares by volume:</span> {summary}
        </p>
      ) : null}
      {shares ? <LayerVocNote kind={kind} parts={values.map((c) => ({ share: shares.find((x) => x.name === c.label.trim())?.share ?? 0, material: byId.get(c.materialId) }))} /> : null}
      <div className="mt-3 flex flex-wrap items-start gap-3">
        <Button
          variant="secondary"
          size="sm"
          disabled={values.length >= MAX_LAYER_COMPONENTS}
          onClick={() => rows.append({ materialId: "", label: "", mode: "parts", parts: "1", percent: "", percentOf: [] })}
          icon={<Plus aria-hidden className="size-4" />}
        >
          Add material
        </Button>
        <SafetyCautions cautions={cautions} compact className="min-w-0 flex-1" />
      </div>
    </fieldset>
  );
}
