import { useState, type DragEvent } from "react";
import { useFieldArray, useForm, type Path } from "react-hook-form";
import { MAX_PLAN_LAYERS, type PlanDocument, type PlanDocumentInput, type PlanDto } from "@shared/schemas/plan.schema";
import type { MaterialDto } from "@shared/schemas/material.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { FormActions } from "@/components/ui/form/form-actions";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { cn } from "@/utils/cn";
import { useVersionGuard } from "@/hooks/use-version-guard";
import { VersionConflictNotice } from "@/components/ui/version-conflict-notice";

import { editorValuesOf, newLayer, toDocument, type EditorValues } from "./editor-values";
import { planResolver } from "./editor-resolver";
import { AddLayer, LayerCard } from "./layer-card";

/*
 * The plan editor: the whole layer stack in one form. Layers move with the up/down buttons (touch, keyboard)
 * or by dragging the handle. Each layer's mix is checked with the mix engine as it is typed, and the
 * engine's message is shown beside the component field at fault; the server checks the same on save.
 */

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
  const form = useForm<EditorValues, unknown, PlanDocument>({ resolver: planResolver, defaultValues: editorValuesOf(plan) });
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
