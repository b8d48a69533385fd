import { useState } from "react";
import { Link, useNavigate } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { Ban, Printer, Trash2 } from "lucide-react";
import { LAYER_KIND_LABELS } from "@shared/domain/layers";
import { MIX_SHEET_STATUS_LABELS, type MixSheetDto } from "@shared/schemas/mix-sheet.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { Spinner } from "@/components/ui/spinner";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { cn } from "@/utils/cn";
import { formatDateTime } from "@/utils/format-date";
import { formatAmount, formatNumber } from "@/utils/format-quantity";
import { mixSheetQueries, useDeleteMixSheet, useRecordMixSheet, useVoidMixSheet } from "@/features/plans/api/mix-sheets.queries";
import { WeighSteps } from "@/features/plans/components/weigh-steps";
import { MIX_SHEET_PRINT_CSS, MixSheetTable, PotLife, RatioWarning, RecordMixedForm, SheetCautions } from "@/features/plans/components/mix-sheet-view";
import { VocOverLimit } from "@/features/plans/components/layer-voc-note";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

export default function MixSheetRoute() {
  const { id, valid } = useIdParam("sheetId");
  const { data, error, isPending } = useQuery({ ...mixSheetQueries.detail(id), enabled: valid });
  if (!valid || (isApiError(error) && [400, 404].includes(error.status))) return <InPageNotFound what="Mix sheet" backTo={paths.jobs} backLabel="Back to jobs" />;
  if (isPending || !data) return <Spinner label="Loading the mix sheet…" />;
  return <MixSheetPage sheet={data} />;
}

const STATUS_CLASSES = { draft: "bg-flake-100 text-flake-900", mixed: "bg-emerald-100 text-emerald-900", void: "bg-primer-200 text-primer-800" } as const;

function MixSheetPage({ sheet }: { sheet: MixSheetDto }) {
  const record = useRecordMixSheet(sheet.id);
  const [dialog, setDialog] = useState<"void" | "delete" | null>(null);
  return (
    <div className="mix-sheet flex flex-col gap-5">
      <style>{MIX_SHEET_PRINT_CSS}</style>
      <PageHeader
        className="mb-0"
        documentTitle={`Mix sheet #${sheet.id}`}
        eyebrow={
          <Link to={paths.jobPlan(sheet.jobId)} className="underline underline-offset-2">
            Job #{sheet.jobId}: {sheet.jobTitle}
          </Link>
        }
        title={`Mix sheet #${sheet.id}: ${sheet.layerName}`}
        description={
          <span className="flex flex-wrap items-center gap-2">
            <span className={cn("rounded-full px-2 py-0.5 text-xs font-semibold", STATUS_CLASSES[sheet.status])}>{MIX_SHEET_STATUS_LABELS[sheet.status]}</span>
            {LAYER_KIND_LABELS[sheet.layerKind]} · {sheet.planName}, version {sheet.planVersion} · {sheet.mode === "component" ? `from ${formatAmount(sheet.amount, sheet.unit)} of ${sheet.knownLabel}` : `batch of ${formatAmount(sheet.amount, sheet.unit)}`}
          </span>
        }
        actions={
          <span className="print-hidden flex flex-wrap gap-2">
            <Button variant="secondary" onClick={() => window.print()} icon={<Printer aria-hidden className="size-4" />}>
              Print
            </Button>
            {sheet.status !== "void" ? (
              <Button variant="danger" onClick={() => setDialog("void")} icon={<Ban aria-hidden className="size-4" />}>
                Void
              </Button>
            ) : null}
            {sheet.status === "draft" ? (
              <Button variant="ghost" onClick={() => setDialog("delete")} icon={<Trash2 aria-hidden className="size-4" />}>
                Discard
              </Button>
            ) : null}
          </span>
        }
      />
      {sheet.status === "void" ? (
        <Alert tone="warning" title="Voided">
          {formatDateTime(sheet.voidedAt)}
          {sheet.voidedByName ? ` by ${sheet.voidedByName}` : ""}: {sheet.voidReason}
        </Alert>
      ) : null}
      {sheet.planChanged && sheet.status === "draft" ? (
        <Alert tone="warning" title="The plan has changed since this sheet was made">
          This sheet follows version {sheet.planVersion}. Discard it and make a new one from the current plan unless you mean to mix the old recipe.
        </Alert>
      ) : null}
      <section aria-label="Batch" className="flex flex-col gap-3">
        <MixSheetTable sheet={sheet} />
        <RatioWarning sheet={sheet} />
        {sheet.batchWarning ? (
          <Alert tone="warning" title="Not enough for the layer">
            {sheet.batchWarning}
          </Alert>
        ) : null}
        {sheet.status === "draft" ? <WeighSteps sheet={sheet} /> : null}
        {sheet.vocOverLimit && sheet.vocGPerL != null && sheet.vocLimitGPerL != null ? <VocOverLimit kind={sheet.layerKind} gPerL={sheet.vocGPerL} limitGPerL={sheet.vocLimitGPerL} /> : null}
        <div className="flex flex-wrap items-center gap-x-6 gap-y-2">
          <PotLife sheet={sheet} />
          {sheet.vocGPerL != null ? (
            <p className="text-sm text-primer-800">
              {sheet.status === "mixed" ? "Batch VOC" : "Expected VOC"} {formatNumber(sheet.vocGPerL, 0)} g/L (less water and exempt)
            </p>
          ) : null}
          {sheet.mixedAt ? (
            <p className="text-sm text-primer-800">
              Mixed {formatDateTime(sheet.mixedAt)}
              {sheet.mixedByName ? ` by ${sheet.mixedByName}` : ""}
            </p>
          ) : null}
        </div>
        <SheetCautions sheet={sheet} />
        {sheet.status === "draft" ? <p className="print-only text-sm">Mixed by ____________________ at ________ · Booth °F/°C ______ · RH ______ %</p> : null}
      </section>
      {sheet.status === "draft" ? (
        <Panel title="Record as mixed" titleId="record-heading" className="print-hidden">
          <RecordMixedForm
            sheet={sheet}
            onRecord={async (input) => {
              await record.mutateAsync(input);
              toast.success("Batch recorded; stock taken");
            }}
          />
        </Panel>
      ) : null}
      {dialog === "void" ? <VoidDialog sheet={sheet} onClose={() => setDialog(null)} /> : null}
      {dialog === "delete" ? <DiscardDialog sheet={sheet} onClose={() => setDialog(null)} /> : null}
    </div>
  );
}

function VoidDialog({ sheet, onClose }: { sheet: MixSheetDto; onClose: () => void }) {
  const voidSheet = useVoidMixSheet(sheet.id);
  const [reason, setReason] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const [fieldError, setFieldError] = useState<string | undefined>();
  return (
    <Dialog title={`Void mix sheet #${sheet.id}?`} description="A recorded batch is never changed; voiding marks it as not to be counted. Stock already taken stays taken." onClose={onClose}>
      <form
        className="flex flex-col gap-4"
        onSubmit={async (e) => {
          e.preventDefault();
          setProblem(null);
          setFieldError(undefined);
          if (!reason.trim()) {
            setFieldError("Reason is required");
            return;
          }
          try {
            await voidSheet.mutateAsync({ reason });
            toast.success("Mix sheet voided");
            onClose();
          } catch (error) {
            if (isApiError(error)) {
              setFieldError(error.fields.reason);
              setProblem(error.message);
            } else setProblem("Could not void the sheet.");
          }
        }}
      >
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <TextareaField label="Reason" required rows={2} value={reason} onChange={(e) => setReason(e.target.value)} error={fieldError} />
        <div className="flex gap-3">
          <Button type="submit" variant="danger" size="lg" pending={voidSheet.isPending}>
            Void sheet
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Keep it
          </Button>
        </div>
      </form>
    </Dialog>
  );
}

function DiscardDialog({ sheet, onClose }: { sheet: MixSheetDto; onClose: () => void }) {
  const remove = useDeleteMixSheet();
  const navigate = useNavigate();
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <Dialog title={`Discard mix sheet #${sheet.id}?`} description="It was never mixed, so nothing is recorded." onClose={onClose}>
      <div className="flex flex-col gap-4">
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <div className="flex gap-3">
          <Button
            variant="danger"
            size="lg"
            pending={remove.isPending}
            onClick={async () => {
              try {
                await remove.mutateAsync(sheet.id);
                toast.success("Mix sheet discarded");
                navigate(paths.jobPlan(sheet.jobId), { replace: true });
              } catch (error) {
                setProblem(isApiError(error) ? error.message : "Could not discard the sheet.");
              }
            }}
          >
            Discard sheet
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Keep it
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
