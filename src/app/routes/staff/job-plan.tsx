import { useState } from "react";
import { Link, useNavigate } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { Beaker, Layers, Lock, Pencil } from "lucide-react";
import { roleCan } from "@shared/domain/roles";
import { MIX_SHEET_STATUS_LABELS } from "@shared/schemas/mix-sheet.schema";
import type { PlanDto, PlanEstimateDto, PlanLayerDto } from "@shared/schemas/plan.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button, ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { SelectField } from "@/components/ui/form/select-field";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { shopSettingsQueries } from "@/lib/shop-settings.queries";
import { paths } from "@/config/paths";
import { cn } from "@/utils/cn";
import { formatDateTime } from "@/utils/format-date";
import { formatAmount, formatNumber } from "@/utils/format-quantity";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { jobQueries } from "@/features/jobs/api/jobs.queries";
import { mixSheetQueries, useCreateMixSheet } from "@/features/plans/api/mix-sheets.queries";
import { planQueries, useStartJobPlan } from "@/features/plans/api/plans.queries";
import { MixSheetCreateDialog } from "@/features/plans/components/mix-sheet-create-dialog";
import { EstimateTable, PlanLayersView } from "@/features/plans/components/plan-layers-view";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

/** A job's finish plan: the layer stack, the material estimate, and the job's mix sheets. */
export default function JobPlanRoute() {
  const { id, valid } = useIdParam("jobId");
  const job = useQuery({ ...jobQueries.detail(id), enabled: valid });
  const plan = useQuery({ ...planQueries.jobPlan(id), enabled: valid });
  if (!valid || (isApiError(plan.error) && [400, 404].includes(plan.error.status))) return <InPageNotFound what="Job" backTo={paths.jobs} backLabel="Back to jobs" />;
  if (plan.isPending || job.isPending || !plan.data || !job.data) return <Spinner label="Loading the plan…" />;
  const { plan: p, estimate } = plan.data;
  return (
    <>
      <PageHeader
        documentTitle={`Plan · #${id} ${job.data.title}`}
        eyebrow={
          <Link to={paths.job(id)} className="underline underline-offset-2">
            Job #{id}: {job.data.title}
          </Link>
        }
        title={p ? p.name : "Finish plan"}
        description={p?.description ?? undefined}
        actions={p ? <PlanActions plan={p} /> : null}
      />
      {p ? <PlanBody jobId={id} plan={p} estimate={estimate} /> : <StartPlan jobId={id} />}
    </>
  );
}

function PlanActions({ plan }: { plan: PlanDto }) {
  const user = useCurrentUser();
  if (!roleCan(user.role, "office")) return null;
  return (
    <>
      <ButtonLink to={`${paths.plan(plan.id)}/edit`} icon={<Pencil aria-hidden className="size-4" />}>
        Edit plan
      </ButtonLink>
      <ButtonLink variant="secondary" to={paths.plan(plan.id)}>
        Versions
      </ButtonLink>
    </>
  );
}

function PlanBody({ jobId, plan, estimate }: { jobId: number; plan: PlanDto; estimate: PlanEstimateDto | null }) {
  const navigate = useNavigate();
  const create = useCreateMixSheet();
  const unit = useQuery(shopSettingsQueries.public()).data?.defaultVolumeUnit ?? "mL";
  const [mixing, setMixing] = useState<PlanLayerDto | null>(null);
  const v = plan.latest;
  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_28rem]">
      <section aria-labelledby="layers-heading" className="flex min-w-0 flex-col gap-3">
        <h2 id="layers-heading" className="flex flex-wrap items-center gap-2 text-lg font-semibold">
          Layers · version {v.version}
          {v.frozenAt ? (
            <span className="inline-flex items-center gap-1 rounded-full bg-ink-900 px-2 py-0.5 text-xs font-semibold text-white">
              <Lock aria-hidden className="size-3" /> In use at the booth
            </span>
          ) : null}
        </h2>
        {plan.copiedFromName ? <p className="text-sm text-primer-700">Started from “{plan.copiedFromName}”.</p> : null}
        <PlanLayersView
          layers={v.layers}
          estimate={estimate}
          unit={unit}
          layerActions={(layer) =>
            layer.components.length ? (
              <Button size="md" onClick={() => setMixing(layer)} icon={<Beaker aria-hidden className="size-4" />}>
                Mix sheet<span className="sr-only"> for {layer.name}</span>
              </Button>
            ) : null
          }
        />
      </section>
      <div className="flex flex-col gap-6 self-start">
        {estimate ? (
          <Panel title="Material estimate" titleId="estimate-heading">
            <EstimateTable estimate={estimate} unit={unit} />
          </Panel>
        ) : null}
        <MixSheetsPanel jobId={jobId} />
      </div>
      {mixing ? (
        <MixSheetCreateDialog
          jobId={jobId}
          layer={mixing}
          defaultUnit={unit}
          onClose={() => setMixing(null)}
          onCreate={async (input) => {
            const sheet = await create.mutateAsync(input);
            toast.success("Mix sheet ready");
            navigate(paths.mixSheet(sheet.id));
          }}
        />
      ) : null}
    </div>
  );
}

function MixSheetsPanel({ jobId }: { jobId: number }) {
  const { data, isPending } = useQuery(mixSheetQueries.forJob(jobId));
  return (
    <Panel title="Mix sheets" titleId="sheets-heading">
      {isPending ? (
        <Spinner />
      ) : !data?.length ? (
        <p className="text-sm text-primer-700">No batches yet. Make a mix sheet from a layer.</p>
      ) : (
        <ul className="flex flex-col gap-2" aria-labelledby="sheets-heading">
          {data.map((s) => (
            <li key={s.id}>
              <Link to={paths.mixSheet(s.id)} className="flex items-center justify-between gap-3 rounded-lg border border-primer-200 px-3 py-2 hover:bg-primer-50">
                <span className="min-w-0">
                  <span className="block font-semibold">
                    #{s.id} {s.layerName}
                  </span>
                  <span className="block text-xs text-primer-700">
                    {s.mixedAt ? `Mixed ${formatDateTime(s.mixedAt)}${s.mixedByName ? ` by ${s.mixedByName}` : ""}` : `Made ${formatDateTime(s.createdAt)}`}
                  </span>
                </span>
                <span className="text-right text-sm whitespace-nowrap">
                  <span className="block tabular-nums">{formatAmount(s.total, s.unit)}</span>
                  <span
                    className={cn(
                      "rounded-full px-2 py-0.5 text-xs font-semibold",
                      s.status === "mixed" ? "bg-emerald-100 text-emerald-900" : s.status === "void" ? "bg-primer-200 text-primer-800 line-through" : "bg-flake-100 text-flake-900",
                    )}
                  >
                    {MIX_SHEET_STATUS_LABELS[s.status]}
                  </span>
                  {s.vocGPerL != null && s.status === "mixed" ? <span className="block text-xs text-primer-700">{formatNumber(s.vocGPerL, 0)} g/L</span> : null}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}

function StartPlan({ jobId }: { jobId: number }) {
  const user = useCurrentUser();
  const office = roleCan(user.role, "office");
  const templates = useQuery({ ...planQueries.list("template"), enabled: office });
  const jobPlans = useQuery({ ...planQueries.list("job"), enabled: office });
  const start = useStartJobPlan(jobId);
  const [source, setSource] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  if (!office) {
    return (
      <EmptyState icon={<Layers aria-hidden />} title="No finish plan yet">
        The office has not planned this job&apos;s layers yet.
      </EmptyState>
    );
  }
  const others = (jobPlans.data ?? []).filter((p) => p.jobId !== jobId);
  return (
    <Panel title="Start the plan" titleId="start-heading" className="max-w-2xl">
      <form
        className="flex flex-col gap-4"
        onSubmit={async (e) => {
          e.preventDefault();
          setProblem(null);
          const [kind, raw] = source.split(":");
          try {
            await start.mutateAsync(kind === "template" ? { fromPlanId: Number(raw) } : kind === "job" ? { fromJobId: Number(raw) } : {});
            toast.success("Plan started");
          } catch (error) {
            setProblem(isApiError(error) ? error.message : "Could not start the plan.");
          }
        }}
      >
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <p className="text-sm text-primer-700">Start from a template, do it like an earlier job, or build it layer by layer.</p>
        <SelectField label="Start from" value={source} onChange={(e) => setSource(e.target.value)}>
          <option value="">An empty plan</option>
          <optgroup label="Templates">
            {(templates.data ?? []).map((t) => (
              <option key={t.id} value={`template:${t.id}`}>
                {t.name}
              </option>
            ))}
          </optgroup>
          <optgroup label="Another job's plan">
            {others.map((p) => (
              <option key={p.id} value={`job:${p.jobId}`}>
                #{p.jobId} {p.jobTitle}
              </option>
            ))}
          </optgroup>
        </SelectField>
        <div>
          <Button type="submit" size="lg" pending={start.isPending}>
            Start plan
          </Button>
        </div>
      </form>
    </Panel>
  );
}
