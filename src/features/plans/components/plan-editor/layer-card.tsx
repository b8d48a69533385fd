import { useState } from "react";
import { useWatch, type Control, type FieldErrors, type UseFormRegister, type UseFormSetValue } from "react-hook-form";
import { ArrowDown, ArrowUp, ChevronDown, ChevronRight, GripVertical, Plus, Trash2 } from "lucide-react";
import { LAYER_KINDS, LAYER_KIND_LABELS, type LayerKind } from "@shared/domain/layers";
import { type PlanDocument } from "@shared/schemas/plan.schema";
import type { MaterialDto } from "@shared/schemas/material.schema";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";

import type { EditorValues } from "./editor-values";
import { ComponentsEditor } from "./components-editor";

/** Timing fields left empty take the materials' data-sheet figures when the plan is saved. */
const SHEET_HINT = "Empty: from the data sheets";

export function AddLayer({ onAdd, disabled }: { onAdd: (kind: LayerKind) => void; disabled: boolean }) {
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

export type LayerCardProps = {
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

export function LayerCard({ index, count, control, register, setValue, errors, materials, collapsed, onToggle, onMove, onRemove, onDragStart, onDragEnd }: LayerCardProps) {
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
