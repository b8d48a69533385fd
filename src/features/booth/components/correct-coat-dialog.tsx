import { switchTemperatureText, type TempUnit } from "@shared/domain/booth";
import { useState, type ChangeEvent } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { correctCoatLogInputSchema, type CoatLogDto } from "@shared/schemas/booth.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { FormActions } from "@/components/ui/form/form-actions";
import { SelectField } from "@/components/ui/form/select-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { TextField } from "@/components/ui/form/text-field";
import { toast } from "@/components/ui/toast/toast-store";
import { useCorrectCoat } from "../api/booth.queries";
import { formatClock } from "./booth-timers";

type Input = z.input<typeof correctCoatLogInputSchema>;
type Values = z.output<typeof correctCoatLogInputSchema>;
const FIELDS = ["reason", "void", "at", "boothTemp", "tempUnit", "humidityPct", "note"] as const;

/** "2026-12-02T10:15" in local time, for a datetime-local input. */
function localInput(iso: string) {
  const d = new Date(iso);
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** A correction is a new entry that names the one it corrects; only what is changed is sent. */
export function CorrectCoatDialog({ jobId, entry, canVoid, onClose }: { jobId: number; entry: CoatLogDto; canVoid: boolean; onClose: () => void }) {
  const correct = useCorrectCoat(jobId);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    getValues,
    watch,
    formState: { errors, isSubmitting, dirtyFields },
  } = useForm<Input, unknown, Values>({
    resolver: zodResolver(correctCoatLogInputSchema),
    defaultValues: {
      reason: "",
      void: false,
      at: undefined,
      boothTemp: entry.boothTemp != null ? String(entry.boothTemp) : "",
      tempUnit: entry.tempUnit ?? "C",
      humidityPct: entry.humidityPct != null ? String(entry.humidityPct) : "",
      note: entry.note ?? "",
    },
  });
  const voiding = watch("void");

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    // Send only what the painter changed, so the rest carries over from the entry.
    const changed: Partial<Values> = { reason: values.reason, void: values.void };
    if (!values.void) {
      // The time field shows the entry's time to the minute; only a time the painter changed is sent (sending the
      // shown value back would move the coat to the start of its minute, maybe before the job's first coat).
      if (dirtyFields.at && values.at && values.at !== new Date(localInput(entry.at)).toISOString()) changed.at = values.at;
      if (dirtyFields.boothTemp || dirtyFields.tempUnit) {
        changed.boothTemp = values.boothTemp;
        changed.tempUnit = values.tempUnit;
      }
      if (dirtyFields.humidityPct) changed.humidityPct = values.humidityPct;
      if (dirtyFields.note) changed.note = values.note;
    }
    try {
      await correct.mutateAsync({ id: entry.id, ...changed } as Values & { id: number });
      toast.success(values.void ? `Coat ${entry.coatNumber} of ${entry.layerName} marked as not sprayed` : "Correction saved");
      onClose();
    } catch (error) {
      setProblem(applyServerErrors(error, setError, FIELDS));
    }
  });

  return (
    <Dialog title={`Correct coat ${entry.coatNumber} of ${entry.layerName}`} description={`Logged at ${formatClock(entry.at)}. The original entry stays on the record.`} onClose={onClose} size="lg">
      <form onSubmit={submit} noValidate className="flex flex-col gap-4">
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <TextareaField label="What is wrong, and why" required rows={2} error={errors.reason?.message} {...register("reason")} />
        {canVoid ? (
          <label className="flex min-h-12 items-center gap-3 text-base font-semibold text-ink-950">
            <input type="checkbox" className="size-6 accent-candy-600" {...register("void")} />
            This coat was not sprayed (logged by mistake)
          </label>
        ) : null}
        {!voiding ? (
          <>
            <TextField
              label="Real time of the coat"
              type="datetime-local"
              defaultValue={localInput(entry.at)}
              error={errors.at?.message}
              {...register("at", { setValueAs: (v: string) => (v ? new Date(v).toISOString() : undefined) })}
            />
            <div className="grid grid-cols-[1fr_7rem_1fr] gap-3">
              <TextField label="Booth temperature" inputMode="decimal" error={errors.boothTemp?.message} {...register("boothTemp")} />
              <SelectField
                label="Unit"
                error={errors.tempUnit?.message}
                {...register("tempUnit", {
                  onChange: (e: ChangeEvent<HTMLSelectElement>) => {
                    const to = e.target.value as TempUnit;
                    setValue("boothTemp", switchTemperatureText(String(getValues("boothTemp") ?? ""), to === "C" ? "F" : "C", to), { shouldDirty: true });
                  },
                })}
              >
                <option value="C">°C</option>
                <option value="F">°F</option>
              </SelectField>
              <TextField label="Humidity %" inputMode="decimal" error={errors.humidityPct?.message} {...register("humidityPct")} />
            </div>
            <TextField label="Note" error={errors.note?.message} {...register("note")} />
          </>
        ) : null}
        <FormActions>
          <Button type="submit" size="lg" variant={voiding ? "danger" : "primary"} pending={isSubmitting}>
            {voiding ? "Mark as not sprayed" : "Save correction"}
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Cancel
          </Button>
        </FormActions>
      </form>
    </Dialog>
  );
}
