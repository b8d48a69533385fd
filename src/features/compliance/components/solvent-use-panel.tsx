import { useState, type FormEvent } from "react";
import { useQuery } from "@tanstack/react-query";
import { SOLVENT_PURPOSES, SOLVENT_PURPOSE_LABELS, type SolventPurpose } from "@shared/domain/materials";
import { VOLUME_UNIT_IDS, type VolumeUnit } from "@shared/mix/index";
import type { SolventUseDto } from "@shared/schemas/solvent-use.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { formatDateTime } from "@/utils/format-date";
import { formatNumber } from "@/utils/format-quantity";
import { solventMaterialsQuery, useLogSolventUse } from "../api/compliance.queries";

/** Prep and cleaning solvent logged outside a batch, as counted in the VOC log. */
export function SolventUseList({ uses }: { uses: SolventUseDto[] }) {
  if (uses.length === 0) return <p className="px-4 py-4 text-sm text-primer-700 sm:px-5">No solvent logged outside batches in this range.</p>;
  return (
    <ul className="divide-y divide-primer-100 text-sm" aria-label="Solvent use">
      {uses.map((u) => (
        <li key={u.id} className="flex flex-wrap gap-x-4 px-4 py-2 sm:px-5">
          <span className="font-semibold">
            {u.materialCode} {u.materialName}
          </span>
          <span>{SOLVENT_PURPOSE_LABELS[u.purpose]}</span>
          <span className="tabular-nums">
            {formatNumber(u.volumeMl / 1000, 3)} L · {formatNumber(u.vocKg, 3)} kg VOC
          </span>
          <span className="text-primer-800">
            {formatDateTime(u.usedAt)}
            {u.jobTitle ? ` · ${u.jobTitle}` : ""}
            {u.loggedByName ? ` · ${u.loggedByName}` : ""}
          </span>
        </li>
      ))}
    </ul>
  );
}

/** Wax and grease remover on the parts, gun wash at the end of the day: logged here, counted with the batches. */
export function LogSolventUseForm() {
  const materials = useQuery(solventMaterialsQuery());
  const log = useLogSolventUse();
  const [values, setValues] = useState({ materialId: "", purpose: "surface_prep" as SolventPurpose, amount: "", unit: "mL" as VolumeUnit });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setProblem(null);
    setErrors({});
    try {
      await log.mutateAsync({ materialId: values.materialId, purpose: values.purpose, amount: values.amount, unit: values.unit } as never);
      setValues((v) => ({ ...v, amount: "" }));
    } catch (error) {
      if (isApiError(error)) setErrors(error.fields);
      setProblem(error instanceof Error ? error.message : "Not saved");
    }
  };
  return (
    <form onSubmit={submit} noValidate aria-label="Log solvent use" className="flex flex-col gap-3 px-4 py-4 sm:px-5 print:hidden">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <div className="grid gap-3 sm:grid-cols-4">
        <SelectField label="Solvent" error={errors.materialId} value={values.materialId} onChange={(e) => setValues({ ...values, materialId: e.target.value })}>
          <option value="">Choose…</option>
          {(materials.data ?? []).map((m) => (
            <option key={m.id} value={m.id}>
              {m.code} {m.name}
            </option>
          ))}
        </SelectField>
        <SelectField label="Used for" error={errors.purpose} value={values.purpose} onChange={(e) => setValues({ ...values, purpose: e.target.value as SolventPurpose })}>
          {SOLVENT_PURPOSES.map((p) => (
            <option key={p} value={p}>
              {SOLVENT_PURPOSE_LABELS[p]}
            </option>
          ))}
        </SelectField>
        <TextField label="Amount" inputMode="decimal" error={errors.amount} value={values.amount} onChange={(e) => setValues({ ...values, amount: e.target.value })} />
        <SelectField label="Unit" error={errors.unit} value={values.unit} onChange={(e) => setValues({ ...values, unit: e.target.value as VolumeUnit })}>
          {VOLUME_UNIT_IDS.map((u) => (
            <option key={u} value={u}>
              {u}
            </option>
          ))}
        </SelectField>
      </div>
      <Button type="submit" variant="secondary" className="self-start" pending={log.isPending}>
        Log solvent use
      </Button>
    </form>
  );
}
