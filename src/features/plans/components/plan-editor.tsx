import { useMemo, useState, type DragEvent } from "react";
import { useFieldArray, useForm, useWatch, type Control, type FieldErrors, type Path, type Resolver, type UseFormRegister, type UseFormSetValue } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { ArrowDown, ArrowUp, ChevronDown, ChevronRight, GripVertical, Plus, Trash2 } from "lucide-react";
import { LAYER_KINDS, LAYER_KIND_LABELS, type LayerKind } from "@shared/domain/layers";
import { MATERIAL_CATEGORIES, MATERIAL_CATEGORY_LABELS, type MaterialCategory } from "@shared/domain/materials";
import { cautionsFor } from "@shared/domain/safety";
import { layerMixProblem, toMixComponents } from "@shared/domain/layer-mix";
import { resolveShares } from "@shared/mix/index";
import { MAX_LAYER_COMPONENTS, MAX_PLAN_LAYERS, planDocumentSchema, type PlanDocument, type PlanDocumentInput, type PlanDto } from "@shared/schemas/plan.schema";
import type { MaterialDto } from "@shared/schemas/material.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { SafetyCautions } from "@/components/ui/safety-cautions";
import { cn } from "@/utils/cn";
import { formatNumber } from "@/utils/format-quantity";
import { useVersionGuard } from "@/hooks/use-version-guard";
import { VersionConflictNotice } from "@/components/ui/version-conflict-notice";
import { LayerVocNote } from "./layer-voc-note";

/*
 * The plan editor: the whole layer stack in one form. Layers move with the up/down buttons (touch, keyboard)
 * or by dragging the handle. Each layer's mix is checked with the mix engine as it is typed, and the
 * engine's message is shown beside the component field at fault; the server checks the same on save.
 */

type EditorComponent = { materialId: string; label: string; mode: "parts" | "percent"; parts: string; percent: string; percentOf: string[] };
type EditorLayer = {
  kind: LayerKind;
  name: string;
  coats: string;
  flashMinutes: string;
  minutesPerCoat: string;
  dryMinutes: string;
  inductionMinutes: string;
  recoatMinMinutes: string;
  recoatMaxMinutes: string;
  gunTip: string;
  pressurePsi: string;
  overlapPct: string;
  dryFilmPerCoat: string;
  dryFilmUnit: "um" | "mil";
  transferEfficiencyPct: string;
  notes: string;
  components: EditorComponent[];
};
export type EditorValues = { name: string; description: string; versionNote: string; layers: EditorLayer[] };

/** Timing fields left empty take the materials' data-sheet figures when the plan is saved. */
const SHEET_HINT = "Empty: from the data sheets";

const str = (v: number | null | undefined) => (v == null ? "" : String(v));

export function editorValuesOf(plan: PlanDto | null): EditorValues {
  if (!plan) return { name: "", description: "", versionNote: "", layers: [] };
  return {
    name: plan.name,
    description: plan.description ?? "",
    versionNote: "",
    layers: plan.latest.layers.map((l) => ({
      kind: l.kind,
      name: l.name,
      coats: str(l.coats),
      flashMinutes: str(l.flashMinutes),
      minutesPerCoat: str(l.minutesPerCoat),
      dryMinutes: str(l.dryMinutes),
      inductionMinutes: str(l.inductionMinutes),
      recoatMinMinutes: str(l.recoatMinMinutes),
      recoatMaxMinutes: str(l.recoatMaxMinutes),
      gunTip: l.gunTip ?? "",
      pressurePsi: str(l.pressurePsi),
      overlapPct: str(l.overlapPct),
      dryFilmPerCoat: str(l.dryFilmPerCoat),
      dryFilmUnit: l.dryFilmUnit,
      transferEfficiencyPct: str(l.transferEfficiencyPct),
      notes: l.notes ?? "",
      components: l.components.map((c) => ({
        materialId: String(c.materialId),
        label: c.label,
        mode: c.percent != null ? "percent" : "parts",
        parts: str(c.parts),
        percent: str(c.percent),
        percentOf: c.percentOf ?? [],
      })),
    })),
  };
}

const num = (v: string) => (v.trim() === "" ? null : Number(v));

/** The editor's values as the API's plan document (parts or percent, never both). */
export function toDocument(v: EditorValues): PlanDocumentInput {
  return {
    name: v.name,
    description: v.description,
    versionNote: v.versionNote,
    layers: v.layers.map((l) => ({
      kind: l.kind,
      name: l.name,
      coats: l.coats,
      flashMinutes: l.flashMinutes,
      minutesPerCoat: l.minutesPerCoat === "" ? undefined : l.minutesPerCoat,
      dryMinutes: l.dryMinutes,
      inductionMinutes: l.inductionMinutes,
      recoatMinMinutes: l.recoatMinMinutes,
      recoatMaxMinutes: l.recoatMaxMinutes,
      gunTip: l.gunTip,
      pressurePsi: l.pressurePsi,
      overlapPct: l.overlapPct,
      dryFilmPerCoat: l.dryFilmPerCoat,
      dryFilmUnit: l.dryFilmUnit,
      transferEfficiencyPct: l.transferEfficiencyPct === "" ? undefined : l.transferEfficiencyPct,
      notes: l.notes,
      components: l.components.map((c) => ({
        materialId: c.materialId,
        label: c.label.trim(),
        ...(c.mode === "parts" ? { parts: c.parts, percent: null, percentOf: null } : { parts: null, percent: c.percent, percentOf: c.percentOf }),
      })),
    })),
  } as unknown as PlanDocumentInput;
}

/** The mix engine's check of one layer, on the editor's (string) values. */
function mixProblemOf(components: EditorComponent[]) {
  return layerMixProblem(
    components.map((c) => ({
      label: c.label.trim(),
      parts: c.mode === "parts" ? num(c.parts) : null,
      percent: c.mode === "percent" ? num(c.percent) : null,
      percentOf: c.mode === "percent" ? c.percentOf : null,
    })),
  );
}

const schemaResolver = zodResolver(planDocumentSchema);
/** zod (shared schema) on the converted document, then the mix engine on every layer. */
const resolver: Resolver<EditorValues, unknown, PlanDocument> = async (values, context, options) => {
  const result = await (schemaResolver as unknown as Resolver<PlanDocumentInput, unknown, PlanDocument>)(toDocument(values), context, options as never);
  const errors = { ...(result.errors as Record<string, unknown>) } as Record<string, unknown>;
  values.layers.forEach((l, i) => {
    const problem = mixProblemOf(l.components);
    if (problem) setPath(errors, `layers.${i}.${problem.path}`, { type: "mix", message: problem.message });
  });
  if (Object.keys(errors).length) return { values: {}, errors: errors as FieldErrors<EditorValues> };
  return result as never;
};

function setPath(target: Record<string, unknown>, path: string, value: unknown) {
  const keys = path.split(".");
  let at: Record<string, unknown> = target;
  keys.slice(0, -1).forEach((k, i) => {
    const next = at[k];
    if (next === undefined || typeof next !== "object") at[k] = /^\d+$/.test(keys[i + 1]!) ? [] : {};
    at = at[k] as Record<string, unknown>;
  });
  at[keys[keys.length - 1]!] ??= value;
}

const CATEGORY_LABEL: Partial<Record<MaterialCategory, string>> = {
  sealer: "sealer",
  ground_coat: "basecoat",
  toner: "toner",
  intercoat_clear: "clear",
  reducer: "reducer",
  hardener: "hardener",
  clear: "clear",
  additive: "additive",
  adhesion_promoter: "promoter",
  cleaner: "cleaner",
};

function newLayer(kind: LayerKind = "clear"): EditorLayer {
  return {
    kind,
    name: LAYER_KIND_LABELS[kind],
    coats: "2",
    flashMinutes: "10",
    minutesPerCoat: "5",
    dryMinutes: "30",
    inductionMinutes: "",
    recoatMinMinutes: "",
    recoatMaxMinutes: "",
    gunTip: "",
    pressurePsi: "",
    overlapPct: "75",
    dryFilmPerCoat: "",
    dryFilmUnit: "um",
    transferEfficiencyPct: "65",
    notes: "",
    components: [],
  };
}

/** A new template has no edit version yet. */
const NEW_PLAN = { version: 1 };

export function PlanEditor({
  plan,
  materials,
  submitLabel,
  onSave,
  onCancel,
}: {
  plan: PlanDto | null;
  materials: MaterialDto[];
  submitLabel: string;
  /** Saves the document; `version` is the plan's edit version the editor was opened at (or moved on to). */
  onSave: (doc: PlanDocumentInput, version: number) => Promise<unknown>;
  onCancel: () => void;
}) {
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<EditorValues, unknown, PlanDocument>({ resolver, defaultValues: editorValuesOf(plan) });
  const guard = useVersionGuard(plan ?? NEW_PLAN, onSave);
  const showError = (error: unknown) => {
    if (isApiError(error)) {
      let placed = 0;
      for (const [field, message] of Object.entries(error.fields)) {
        setError(field as Path<EditorValues>, { type: "server", message }, { shouldFocus: placed++ === 0 });
      }
      setProblem(error.message);
    } else setProblem("Something went wrong. Try again.");
  };
  const {
    control,
    register,
    handleSubmit,
    setError,
    setValue,
    formState: { errors, isSubmitting },
  } = form;
  const layers = useFieldArray({ control, name: "layers" });
  const [collapsed, setCollapsed] = useState<Set<string>>(new Set());
  const [dragFrom, setDragFrom] = useState<number | null>(null);

  const submit = handleSubmit(
    async () => {
      setProblem(null);
      try {
        await guard.submit(toDocument(form.getValues()));
      } catch (error) {
        showError(error);
      }
    },
    () => setProblem("Check the highlighted fields."),
  );

  const locked = plan?.latest.locked ?? false;
  const onDrop = (to: number) => (e: DragEvent) => {
    e.preventDefault();
    const carried = Number.parseInt(e.dataTransfer.getData("text/plain"), 10);
    const from = Number.isInteger(carried) ? carried : dragFrom;
    if (from !== null && from !== to && from >= 0 && from < layers.fields.length) layers.move(from, to);
    setDragFrom(null);
  };

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-6">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      {guard.conflict ? (
        <VersionConflictNotice
          what="plan"
          conflict={guard.conflict}
          onReload={() => {
            const theirs = guard.reload();
            if (theirs) form.reset(editorValuesOf(theirs as PlanDto));
          }}
          onSaveAgain={() => guard.saveAgain().catch(showError)}
        />
      ) : null}
      {locked ? (
        <Alert tone="info" title={`Version ${plan!.latest.version} has been used`}>
          It is kept exactly as it was sprayed. Saving makes version {plan!.latest.version + 1}.
        </Alert>
      ) : null}
      <div className="grid gap-5 lg:grid-cols-2">
        <TextField label="Plan name" required autoComplete="off" error={errors.name?.message} {...register("name")} />
        <TextField label="Note for this version" hint="What changed, e.g. one more coat of candy" autoComplete="off" error={errors.versionNote?.message} {...register("versionNote")} />
        <TextareaField label="Description" rows={2} fieldClassName="lg:col-span-2" error={errors.description?.message} {...register("description")} />
      </div>

      <section aria-labelledby="layers-heading" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <h2 id="layers-heading" className="text-lg font-semibold">
            Layers, bottom to top
          </h2>
          {errors.layers?.message ? <p className="text-sm font-medium text-red-800">{errors.layers.message}</p> : null}
        </div>
        {layers.fields.length === 0 ? <p className="rounded-lg border border-dashed border-primer-300 bg-white p-4 text-primer-700">No layers yet. Add the first one below.</p> : null}
        <ol className="flex flex-col gap-3">
          {layers.fields.map((field, index) => (
            <li
              key={field.id}
              onDragOver={(e) => {
                e.preventDefault();
                e.dataTransfer.dropEffect = "move";
              }}
              onDrop={onDrop(index)}
              className={cn("rounded-xl border bg-white shadow-card", dragFrom === index ? "border-candy-500 opacity-70" : "border-primer-200")}
            >
              <LayerCard
                index={index}
                count={layers.fields.length}
                control={control}
                register={register}
                setValue={setValue}
                errors={errors}
                materials={materials}
                collapsed={collapsed.has(field.id)}
                onToggle={() =>
                  setCollapsed((s) => {
                    const next = new Set(s);
                    if (next.has(field.id)) next.delete(field.id);
                    else next.add(field.id);
                    return next;
                  })
                }
                onMove={(to) => layers.move(index, to)}
                onRemove={() => layers.remove(index)}
                onDragStart={() => setDragFrom(index)}
                onDragEnd={() => setDragFrom(null)}
              />
            </li>
          ))}
        </ol>
        <AddLayer disabled={layers.fields.length >= MAX_PLAN_LAYERS} onAdd={(kind) => layers.append(newLayer(kind))} />
      </section>

      <FormActions className="sticky bottom-0 z-10 -mx-4 border-t border-primer-200 bg-primer-50/95 px-4 py-3 backdrop-blur sm:-mx-6 sm:px-6">
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

function AddLayer({ onAdd, disabled }: { onAdd: (kind: LayerKind) => void; disabled: boolean }) {
  const [kind, setKind] = useState<LayerKind>("sealer");
  return (
    <div className="flex flex-wrap items-end gap-3 rounded-xl border border-dashed border-primer-300 p-3">
      <SelectField label="New layer kind" value={kind} onChange={(e) => setKind(e.target.value as LayerKind)} fieldClassName="min-w-48">
        {LAYER_KINDS.map((k) => (
          <option key={k} value={k}>
            {LAYER_KIND_LABELS[k]}
          </option>
        ))}
      </SelectField>
      <Button variant="secondary" disabled={disabled} onClick={() => onAdd(kind)} icon={<Plus aria-hidden className="size-4" />}>
        Add layer
      </Button>
    </div>
  );
}

type LayerCardProps = {
  index: number;
  count: number;
  control: Control<EditorValues, unknown, PlanDocument>;
  register: UseFormRegister<EditorValues>;
  setValue: UseFormSetValue<EditorValues>;
  errors: FieldErrors<EditorValues>;
  materials: MaterialDto[];
  collapsed: boolean;
  onToggle: () => void;
  onMove: (to: number) => void;
  onRemove: () => void;
  onDragStart: () => void;
  onDragEnd: () => void;
};

function LayerCard({ index, count, control, register, setValue, errors, materials, collapsed, onToggle, onMove, onRemove, onDragStart, onDragEnd }: LayerCardProps) {
  const layer = useWatch({ control, name: `layers.${index}` });
  const e = errors.layers?.[index];
  const title = `Layer ${index + 1}: ${layer?.name || LAYER_KIND_LABELS[layer?.kind ?? "clear"]}`;
  const p = `layers.${index}` as const;
  return (
    <div>
      <div className="flex flex-wrap items-center gap-2 border-b border-primer-100 px-2 py-2 sm:px-3">
        <span
          draggable
          onDragStart={(ev) => {
            ev.dataTransfer.effectAllowed = "move";
            ev.dataTransfer.setData("text/plain", String(index));
            onDragStart();
          }}
          onDragEnd={onDragEnd}
          title="Drag to reorder"
          className="grid size-10 cursor-grab place-items-center rounded-md text-primer-600 hover:bg-primer-100"
        >
          <GripVertical aria-hidden className="pointer-events-none size-5" />
        </span>
        <button type="button" onClick={onToggle} aria-expanded={!collapsed} className="flex min-h-10 min-w-0 flex-1 items-center gap-2 rounded-md px-1 text-left hover:bg-primer-50">
          {collapsed ? <ChevronRight aria-hidden className="size-5 shrink-0" /> : <ChevronDown aria-hidden className="size-5 shrink-0" />}
          <span className="truncate text-base font-semibold">{title}</span>
          <span className="shrink-0 rounded-full bg-ink-50 px-2 py-0.5 text-xs font-semibold text-ink-800">{LAYER_KIND_LABELS[layer?.kind ?? "clear"]}</span>
          {e ? <span className="shrink-0 text-xs font-semibold text-red-800">Needs attention</span> : null}
        </button>
        <div className="flex gap-1">
          <Button variant="ghost" size="sm" disabled={index === 0} onClick={() => onMove(index - 1)} aria-label={`Move layer ${index + 1} up`} icon={<ArrowUp aria-hidden className="size-4" />} />
          <Button variant="ghost" size="sm" disabled={index === count - 1} onClick={() => onMove(index + 1)} aria-label={`Move layer ${index + 1} down`} icon={<ArrowDown aria-hidden className="size-4" />} />
          <Button variant="ghost" size="sm" onClick={onRemove} aria-label={`Remove layer ${index + 1}`} icon={<Trash2 aria-hidden className="size-4" />} />
        </div>
      </div>
      <div hidden={collapsed} className="flex flex-col gap-4 p-3 sm:p-4">
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          <SelectField label="Kind" error={e?.kind?.message} {...register(`${p}.kind`)}>
            {LAYER_KINDS.map((k) => (
              <option key={k} value={k}>
                {LAYER_KIND_LABELS[k]}
              </option>
            ))}
          </SelectField>
          <TextField label="Layer name" fieldClassName="lg:col-span-3" autoComplete="off" error={e?.name?.message} {...register(`${p}.name`)} />
          <TextField label="Coats" inputMode="decimal" error={e?.coats?.message} {...register(`${p}.coats`)} />
          <TextField label="Flash between coats (min)" inputMode="decimal" error={e?.flashMinutes?.message} {...register(`${p}.flashMinutes`)} />
          <TextField label="Spray time per coat (min)" inputMode="decimal" error={e?.minutesPerCoat?.message} {...register(`${p}.minutesPerCoat`)} />
          <TextField label="Dry before next layer (min)" inputMode="decimal" error={e?.dryMinutes?.message} {...register(`${p}.dryMinutes`)} />
          <TextField label="Induction after mixing (min)" inputMode="decimal" hint={SHEET_HINT} error={e?.inductionMinutes?.message} {...register(`${p}.inductionMinutes`)} />
          <TextField label="Recoat no sooner than (min)" inputMode="decimal" hint={SHEET_HINT} error={e?.recoatMinMinutes?.message} {...register(`${p}.recoatMinMinutes`)} />
          <TextField label="Recoat no later than (min)" inputMode="decimal" hint={SHEET_HINT} error={e?.recoatMaxMinutes?.message} {...register(`${p}.recoatMaxMinutes`)} />
          <TextField label="Gun tip" placeholder="1.3 mm" autoComplete="off" error={e?.gunTip?.message} {...register(`${p}.gunTip`)} />
          <TextField label="Air pressure (psi)" inputMode="decimal" error={e?.pressurePsi?.message} {...register(`${p}.pressurePsi`)} />
          <TextField label="Overlap (%)" inputMode="decimal" error={e?.overlapPct?.message} {...register(`${p}.overlapPct`)} />
          <TextField label="Transfer efficiency (%)" inputMode="decimal" hint="HVLP about 65 %" error={e?.transferEfficiencyPct?.message} {...register(`${p}.transferEfficiencyPct`)} />
          <TextField label="Dry film per coat" inputMode="decimal" error={e?.dryFilmPerCoat?.message} {...register(`${p}.dryFilmPerCoat`)} />
          <SelectField label="Film unit" error={e?.dryFilmUnit?.message} {...register(`${p}.dryFilmUnit`)}>
            <option value="um">µm (micrometres)</option>
            <option value="mil">mil (0.001 in)</option>
          </SelectField>
          <TextareaField label="Notes" rows={1} fieldClassName="sm:col-span-2" error={e?.notes?.message} {...register(`${p}.notes`)} />
        </div>
        <ComponentsEditor layerIndex={index} control={control} register={register} setValue={setValue} errors={errors} materials={materials} />
      </div>
    </div>
  );
}

function ComponentsEditor({
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
                      if (m && !c?.label) setValue(`${rowName}.label`, uniqueLabel(CATEGORY_LABEL[m.category] ?? "part", others));
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

function uniqueLabel(base: string, taken: string[]): string {
  if (!taken.includes(base)) return base;
  for (let i = 2; ; i++) if (!taken.includes(`${base} ${i}`)) return `${base} ${i}`;
}
