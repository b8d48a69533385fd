import { useState, type ReactNode } from "react";
import { useFieldArray, useForm, type Path } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import {
  EXISTING_FINISH_LABELS,
  EXISTING_FINISHES,
  FIBREGLASS_FINDINGS,
  FINDING_LABELS,
  FINDING_LEVEL_LABELS,
  FINDING_LEVELS,
  FINDINGS,
  isFibreglass,
  SOLVENT_TEST_LABELS,
  SOLVENT_TEST_RESULTS,
} from "@shared/domain/intake";
import { cautionsFor } from "@shared/domain/safety";
import { AREA_UNIT_LABELS, AREA_UNITS, SUBSTRATE_LABELS } from "@shared/domain/substrates";
import { saveInspectionInputSchema, type InspectionDto } from "@shared/schemas/inspection.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { useVersionGuard } from "@/hooks/use-version-guard";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { EnumOptions } from "@/components/ui/form/enum-options";
import { FormActions } from "@/components/ui/form/form-actions";
import { SelectField } from "@/components/ui/form/select-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { TextField } from "@/components/ui/form/text-field";
import { SafetyCautions } from "@/components/ui/safety-cautions";
import { VersionConflictNotice } from "@/components/ui/version-conflict-notice";
import { toast } from "@/components/ui/toast/toast-store";
import { useSaveInspection } from "../api/intake.queries";

type Input = z.input<typeof saveInspectionInputSchema>;
type Output = z.output<typeof saveInspectionInputSchema>;

/** The form's values for an inspection as it is (an item never inspected starts as "not known, nothing found"). */
function valuesOf(inspection: InspectionDto): Input {
  return {
    version: inspection.version,
    customerSummary: inspection.customerSummary ?? "",
    notes: inspection.notes ?? "",
    items: inspection.items.map((it) => {
      const i = it.inspection;
      return {
        itemId: it.itemId,
        existingFinish: i?.existingFinish ?? "unknown",
        ...Object.fromEntries(FINDINGS.map((f) => [f, i?.[f] ?? "none"])),
        hardwareToRemove: i?.hardwareToRemove ?? "",
        measuredArea: i?.measuredArea != null ? String(i.measuredArea) : "",
        areaUnit: i?.measuredAreaUnit ?? it.areaUnit,
        solventTest: i?.solventTest ?? "not_done",
        note: i?.note ?? "",
      } as Input["items"][number];
    }),
  };
}

/** The solvent test uses lacquer thinner on a rag: flammable, with the line that defers to the data sheet. */
const SOLVENT_CAUTIONS = cautionsFor([{ flammable: true }]);

/**
 * The estimator's intake inspection of every item on the job: the condition checklist, the area as measured, the
 * solvent test of the existing finish, a note, and (once saved) photos. `photos` renders an item's photo panel.
 */
export function InspectionForm({ inspection, photos }: { inspection: InspectionDto; photos: (inspectionItemId: number, itemName: string) => ReactNode }) {
  const save = useSaveInspection(inspection.jobId);
  const [problem, setProblem] = useState<string | null>(null);
  const form = useForm<Input, unknown, Output>({ resolver: zodResolver(saveInspectionInputSchema), defaultValues: valuesOf(inspection) });
  const { register, handleSubmit, setError, reset, formState } = form;
  const { fields } = useFieldArray({ control: form.control, name: "items" });
  const guard = useVersionGuard(inspection, (values: Output, version: number) => save.mutateAsync({ ...values, version }));
  const errors = formState.errors;

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      const saved = await guard.submit(values);
      if (saved) toast.success("Inspection saved");
    } catch (error) {
      setProblem(applyServerErrors(error, setError, fieldPaths(fields.length)));
    }
  });

  return (
    <form onSubmit={submit} noValidate aria-label="Intake inspection" className="flex flex-col gap-5">
      {guard.conflict ? (
        <VersionConflictNotice
          what="inspection"
          conflict={guard.conflict}
          busy={save.isPending}
          onReload={() => {
            const current = guard.reload();
            if (current) reset(valuesOf(current));
          }}
          onSaveAgain={() => void guard.saveAgain().then((ok) => ok && toast.success("Inspection saved"))}
        />
      ) : null}
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <SafetyCautions cautions={SOLVENT_CAUTIONS} />
      {fields.map((field, i) => {
        const item = inspection.items[i]!;
        const glass = isFibreglass(item.substrate);
        const e = errors.items?.[i];
        const headingId = `inspect-item-${item.itemId}`;
        return (
          <section key={field.id} aria-labelledby={headingId} className="rounded-xl border border-primer-200 bg-white p-4 shadow-card sm:p-5">
            <h2 id={headingId} className="text-xl font-semibold text-ink-950">
              {item.itemName}
            </h2>
            <p className="mb-4 text-sm text-primer-800">
              {SUBSTRATE_LABELS[item.substrate]} · {item.surfaceArea} {AREA_UNIT_LABELS[item.areaUnit]} on the job
              {item.suggestion ? ` · suggests ${item.suggestion.hours} h of prep` : ""}
            </p>
            <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
              <SelectField label="Existing finish" error={e?.existingFinish?.message} {...register(`items.${i}.existingFinish`)}>
                <EnumOptions values={EXISTING_FINISHES} labels={EXISTING_FINISH_LABELS} />
              </SelectField>
              <SelectField label="Solvent test" hint="Thinner on a rag, held on the old finish" error={e?.solventTest?.message} {...register(`items.${i}.solventTest`)}>
                <EnumOptions values={SOLVENT_TEST_RESULTS} labels={SOLVENT_TEST_LABELS} />
              </SelectField>
              {FINDINGS.filter((f) => glass || !FIBREGLASS_FINDINGS.includes(f)).map((f) => (
                <SelectField key={f} label={FINDING_LABELS[f]} error={e?.[f]?.message} {...register(`items.${i}.${f}`)}>
                  <EnumOptions values={FINDING_LEVELS} labels={FINDING_LEVEL_LABELS} />
                </SelectField>
              ))}
              <TextField label="Hardware to remove" hint="Badges, studs, snaps… (empty for none)" error={e?.hardwareToRemove?.message} {...register(`items.${i}.hardwareToRemove`)} />
              <div className="grid grid-cols-[minmax(0,12rem)_7rem] gap-2 sm:col-span-2 lg:col-span-2">
                <TextField label="Measured area" inputMode="decimal" hint={`Empty: the job's ${item.surfaceArea} ${AREA_UNIT_LABELS[item.areaUnit]}`} error={e?.measuredArea?.message} {...register(`items.${i}.measuredArea`)} />
                <SelectField label="Unit" error={e?.areaUnit?.message} {...register(`items.${i}.areaUnit`)}>
                  <EnumOptions values={AREA_UNITS} labels={AREA_UNIT_LABELS} />
                </SelectField>
              </div>
            </div>
            <TextareaField fieldClassName="mt-4" label="Note (shop only)" rows={2} error={e?.note?.message} {...register(`items.${i}.note`)} />
            <div className="mt-4">{item.inspection ? photos(item.inspection.id, item.itemName) : <p className="text-sm text-primer-700">Save the inspection to add photos of {item.itemName}.</p>}</div>
          </section>
        );
      })}
      <div className="grid gap-4 lg:grid-cols-2">
        <TextareaField label="Summary for the customer" hint="Shown with the quote in the portal" error={errors.customerSummary?.message} {...register("customerSummary")} />
        <TextareaField label="Shop notes" hint="Never shown to the customer" error={errors.notes?.message} {...register("notes")} />
      </div>
      <FormActions>
        <Button type="submit" size="lg" pending={formState.isSubmitting}>
          Save inspection
        </Button>
      </FormActions>
    </form>
  );
}

/** Every field a server error may name, for placing it beside its input. */
function fieldPaths(items: number): Path<Input>[] {
  const per = ["itemId", "existingFinish", "solventTest", "hardwareToRemove", "measuredArea", "areaUnit", "note", ...FINDINGS] as const;
  return ["customerSummary", "notes", "items", ...Array.from({ length: items }, (_, i) => per.map((k) => `items.${i}.${k}` as Path<Input>)).flat()];
}
