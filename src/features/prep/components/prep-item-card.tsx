import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { BadgeCheck, RotateCcw } from "lucide-react";
import { PREP_STATUS_LABELS, PREP_STEP_LABELS, SCUFF_MEDIA, SCUFF_MEDIUM_LABELS } from "@shared/domain/prep";
import { SUBSTRATE_LABELS } from "@shared/domain/substrates";
import { prepStepsInputSchema, reopenPrepRecordInputSchema, type JobPrepDto, type PrepRecordDto } from "@shared/schemas/prep.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { FormActions } from "@/components/ui/form/form-actions";
import { SelectField } from "@/components/ui/form/select-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { TextField } from "@/components/ui/form/text-field";
import { toast } from "@/components/ui/toast/toast-store";
import { formatDateTime } from "@/utils/format-date";
import { cn } from "@/utils/cn";
import { useReopenPrep, useSavePrep, useSignOffPrep } from "../api/prep.queries";

type Item = JobPrepDto["items"][number];
type StepsInput = z.input<typeof prepStepsInputSchema>;
type StepsValues = z.output<typeof prepStepsInputSchema>;
const FIELDS = ["scuffMedium", "scuffGrit", "cleaner", "tackCloth", "adhesionPromoter", "adhesionPromoterProduct", "notes"] as const;

/** One item's prep: record the steps, see what is missing, sign off; the office can reopen a sign-off. */
export function PrepItemCard({ jobId, item, canReopen, photos }: { jobId: number; item: Item; canReopen: boolean; photos?: React.ReactNode }) {
  const record = item.record;
  const headingId = `prep-item-${item.itemId}`;
  return (
    <section aria-labelledby={headingId} className="rounded-xl border border-primer-200 bg-white shadow-card">
      <div className="flex flex-wrap items-center justify-between gap-3 border-b border-primer-200 px-4 py-3 sm:px-5">
        <div>
          <h2 id={headingId} className="text-xl font-semibold text-ink-950">
            {item.itemName}
          </h2>
          <p className="text-sm text-primer-800">
            {SUBSTRATE_LABELS[item.substrate]}
            {item.needsAdhesionPromoter ? " · bare plastic: needs adhesion promoter" : ""}
          </p>
        </div>
        <span
          className={cn(
            "rounded-full px-3 py-1 text-sm font-semibold",
            item.status === "signed_off" ? "bg-emerald-100 text-emerald-950" : item.status === "in_progress" ? "bg-flake-100 text-flake-900" : "bg-primer-200 text-ink-950",
          )}
        >
          {PREP_STATUS_LABELS[item.status]}
        </span>
      </div>
      <div className="flex flex-col gap-5 p-4 sm:p-5">
        {record?.status === "signed_off" ? <SignedOff jobId={jobId} record={record} canReopen={canReopen} /> : <PrepForm key={record?.preparedAt ?? "new"} jobId={jobId} item={item} record={record} />}
        {record?.reopenedNote ? <p className="text-sm whitespace-pre-line text-primer-800">{record.reopenedNote}</p> : null}
        {record ? photos : <p className="text-sm text-primer-700">Save the first steps to add photos.</p>}
      </div>
    </section>
  );
}

function SignedOff({ jobId, record, canReopen }: { jobId: number; record: PrepRecordDto; canReopen: boolean }) {
  const [reopening, setReopening] = useState(false);
  return (
    <div className="flex flex-col gap-3">
      <p className="flex items-center gap-2 text-base font-semibold text-emerald-900">
        <BadgeCheck aria-hidden className="size-6" />
        Signed off by {record.signedOffByName ?? "a former user"} on {formatDateTime(record.signedOffAt)}
      </p>
      <StepSummary record={record} />
      {canReopen ? (
        <div>
          <Button variant="secondary" size="lg" icon={<RotateCcw aria-hidden className="size-5" />} onClick={() => setReopening(true)}>
            Reopen sign-off
          </Button>
        </div>
      ) : null}
      {reopening ? <ReopenDialog jobId={jobId} record={record} onClose={() => setReopening(false)} /> : null}
    </div>
  );
}

function StepSummary({ record }: { record: PrepRecordDto }) {
  const rows: [string, string][] = [
    ["Scuffed", record.scuffMedium ? `${SCUFF_MEDIUM_LABELS[record.scuffMedium]}${record.scuffGrit ? `, P${record.scuffGrit}` : ""}` : "—"],
    ["Cleaned with", record.cleaner ?? "—"],
    ["Tack cloth", record.tackCloth ? "Yes" : "No"],
  ];
  if (record.needsAdhesionPromoter || record.adhesionPromoter) rows.push(["Adhesion promoter", record.adhesionPromoter ? (record.adhesionPromoterProduct ?? "Yes") : "No"]);
  rows.push(["Recorded by", `${record.preparedByName ?? "Former user"}, ${formatDateTime(record.preparedAt)}`]);
  if (record.notes) rows.push(["Notes", record.notes]);
  return (
    <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[auto_1fr]">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-sm font-semibold text-primer-800">{k}</dt>
          <dd className="text-base text-ink-950">{v}</dd>
        </div>
      ))}
    </dl>
  );
}

function PrepForm({ jobId, item, record }: { jobId: number; item: Item; record: PrepRecordDto | null }) {
  const save = useSavePrep(jobId);
  const signOff = useSignOffPrep(jobId);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<StepsInput, unknown, StepsValues>({
    resolver: zodResolver(prepStepsInputSchema),
    defaultValues: {
      scuffMedium: record?.scuffMedium ?? "",
      scuffGrit: record?.scuffGrit != null ? `P${record.scuffGrit}` : "",
      cleaner: record?.cleaner ?? "",
      tackCloth: record?.tackCloth ?? false,
      adhesionPromoter: record?.adhesionPromoter ?? false,
      adhesionPromoterProduct: record?.adhesionPromoterProduct ?? "",
      notes: record?.notes ?? "",
    },
  });

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await save.mutateAsync(record ? { id: record.id, ...values, version: record.version } : { itemId: item.itemId, ...values });
      toast.success(`Prep of ${item.itemName} saved`);
    } catch (error) {
      setProblem(applyServerErrors(error, setError, FIELDS));
    }
  });

  const sign = async () => {
    if (!record) return;
    setProblem(null);
    try {
      await signOff.mutateAsync(record.id);
      toast.success(`${item.itemName}: prep signed off`);
    } catch (error) {
      setProblem(applyServerErrors(error, setError, FIELDS));
    }
  };

  const check = "flex min-h-14 items-center gap-3 rounded-xl border-2 border-primer-300 bg-white px-4 text-base font-semibold text-ink-950 has-checked:border-emerald-700 has-checked:bg-emerald-50";
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4" aria-label={`Prep steps for ${item.itemName}`}>
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      <div className="grid gap-4 sm:grid-cols-[1fr_10rem]">
        <SelectField label="Scuffed with" error={errors.scuffMedium?.message} {...register("scuffMedium")}>
          <option value="">Not yet</option>
          {SCUFF_MEDIA.map((m) => (
            <option key={m} value={m}>
              {SCUFF_MEDIUM_LABELS[m]}
            </option>
          ))}
        </SelectField>
        <TextField label="Grit" placeholder="e.g. P600" hint="P600 or 600" error={errors.scuffGrit?.message} {...register("scuffGrit")} />
      </div>
      <TextField label="Cleaner" placeholder="e.g. wax and grease remover, then final wipe" list={`prep-cleaners-${item.itemId}`} error={errors.cleaner?.message} {...register("cleaner")} />
      <datalist id={`prep-cleaners-${item.itemId}`}>
        <option value="Wax and grease remover" />
        <option value="Waterborne final wipe" />
        <option value="Plastic cleaner" />
      </datalist>
      <label className={check}>
        <input type="checkbox" className="size-6 accent-emerald-700" {...register("tackCloth")} />
        {PREP_STEP_LABELS.tack}: wiped with a tack cloth just before spraying
      </label>
      {item.needsAdhesionPromoter || record?.adhesionPromoter ? (
        <div className="grid gap-3 sm:grid-cols-[auto_1fr] sm:items-end">
          <label className={check}>
            <input type="checkbox" className="size-6 accent-emerald-700" {...register("adhesionPromoter")} />
            {PREP_STEP_LABELS.adhesionPromoter} applied
          </label>
          <TextField label="Adhesion promoter used" error={errors.adhesionPromoterProduct?.message} {...register("adhesionPromoterProduct")} />
        </div>
      ) : null}
      <TextareaField label="Prep notes" rows={2} error={errors.notes?.message} {...register("notes")} />
      {record && record.missingSteps.length ? (
        <p className="text-sm font-medium text-flake-900">Still to record: {record.missingSteps.map((s) => PREP_STEP_LABELS[s].toLowerCase()).join(", ")}.</p>
      ) : null}
      <FormActions>
        <Button type="submit" size="lg" variant={record ? "secondary" : "primary"} pending={isSubmitting}>
          {record ? "Save steps" : "Start prep record"}
        </Button>
        {record ? (
          <Button size="lg" pending={signOff.isPending} disabled={isDirty} onClick={() => void sign()} icon={<BadgeCheck aria-hidden className="size-5" />}>
            Sign off prep
          </Button>
        ) : null}
        {record && isDirty ? <span className="text-sm text-primer-800">Save the changes before signing off.</span> : null}
      </FormActions>
    </form>
  );
}

type ReopenInput = z.input<typeof reopenPrepRecordInputSchema>;
type ReopenValues = z.output<typeof reopenPrepRecordInputSchema>;

function ReopenDialog({ jobId, record, onClose }: { jobId: number; record: PrepRecordDto; onClose: () => void }) {
  const reopen = useReopenPrep(jobId);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<ReopenInput, unknown, ReopenValues>({ resolver: zodResolver(reopenPrepRecordInputSchema), defaultValues: { reason: "" } });
  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await reopen.mutateAsync({ id: record.id, reason: values.reason });
      toast.success("Prep reopened");
      onClose();
    } catch (error) {
      setProblem(applyServerErrors(error, setError, ["reason"]));
    }
  });
  return (
    <Dialog title={`Reopen the prep of ${record.itemName}`} description="The sign-off is taken back; the reason stays on the record." onClose={onClose}>
      <form noValidate className="flex flex-col gap-4" onSubmit={submit}>
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <TextareaField label="Reason" required rows={3} error={errors.reason?.message} {...register("reason")} />
        <FormActions>
          <Button type="submit" size="lg" pending={isSubmitting}>
            Reopen
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Cancel
          </Button>
        </FormActions>
      </form>
    </Dialog>
  );
}
