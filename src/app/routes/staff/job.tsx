import { useState } from "react";
import { useNavigate } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { ClipboardList, Pencil, Trash2 } from "lucide-react";
import { roleCan } from "@shared/domain/roles";
import type { JobDetailDto } from "@shared/schemas/job.schema";
import { isApiError } from "@/lib/api-client";
import { Button, ButtonLink } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { customerQueries } from "@/features/customers/api/customers.queries";
import { jobQueries, useUpdateJob } from "@/features/jobs/api/jobs.queries";
import { DeleteJobDialog } from "@/features/jobs/components/delete-job-dialog";
import { JobFacts } from "@/features/jobs/components/job-facts";
import { JobForm } from "@/features/jobs/components/job-form";
import { JobItemsPanel } from "@/features/jobs/components/job-items-panel";
import { JobPlanSummary } from "@/features/plans/components/job-plan-summary";
import { StageBadge } from "@/features/jobs/components/stage-badge";
import { StageHistory } from "@/features/jobs/components/stage-history";
import { StageMoveOptions } from "@/features/jobs/components/stage-move-options";
import { userQueries } from "@/features/users/api/users.queries";
import { JobBoothSummary } from "@/features/booth/components/job-booth-summary";
import { JobFinishRecordPanel } from "@/features/finish-record/components/job-finish-record-panel";
import { JobColourPanel } from "@/features/panels/components/job-colour-panel";
import { PhotoPanel } from "@/features/uploads/components/photo-panel";
import { JobMessagesPanel } from "@/features/quotes/components/job-messages-panel";
import { JobQuotesPanel } from "@/features/quotes/components/job-quotes-panel";
import { JobChangeOrdersPanel } from "@/features/change-orders/components/job-change-orders-panel";
import { settingsQueries } from "@/features/settings/api/settings.queries";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

export default function JobRoute() {
  const { id, valid } = useIdParam("jobId");
  const { data: job, error, isPending } = useQuery({ ...jobQueries.detail(id), enabled: valid });

  if (!valid || (isApiError(error) && (error.status === 404 || error.status === 400)))
    return <InPageNotFound what="Job" backTo={paths.jobs} backLabel="Back to jobs" />;
  if (isPending || !job) return <Spinner label="Loading the job…" />;
  return <JobPage job={job} />;
}

function JobPage({ job }: { job: JobDetailDto }) {
  const user = useCurrentUser();
  const navigate = useNavigate();
  const office = roleCan(user.role, "office");
  const [dialog, setDialog] = useState<"edit" | "delete" | null>(null);
  const settings = useQuery({ ...settingsQueries.full(), enabled: office });

  return (
    <>
      <PageHeader
        documentTitle={`#${job.id} ${job.title}`}
        eyebrow={<span className="tabular-nums">Job #{job.id}</span>}
        title={job.title}
        actions={
          office ? (
            <>
              <ButtonLink to={paths.jobInspection(job.id)} variant="secondary" icon={<ClipboardList aria-hidden className="size-4" />}>
                Intake inspection
              </ButtonLink>
              <Button variant="secondary" onClick={() => setDialog("edit")} icon={<Pencil aria-hidden className="size-4" />}>
                Edit job
              </Button>
              {job.stage === "inquiry" ? (
                <Button variant="danger" onClick={() => setDialog("delete")} icon={<Trash2 aria-hidden className="size-4" />}>
                  Delete
                </Button>
              ) : null}
            </>
          ) : null
        }
      />
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="flex min-w-0 flex-col gap-6">
          <Panel title="Stage" titleId="stage-heading" actions={<StageBadge stage={job.stage} size="lg" />}>
            <StageMoveOptions jobId={job.id} current={job.stage} moves={job.nextStages} />
          </Panel>
          <Panel>
            <JobFacts job={job} linkCustomer={office} />
            {job.notes ? (
              <div className="mt-5 border-t border-primer-200 pt-4">
                <h2 className="text-xs font-semibold tracking-wide text-primer-700 uppercase">Shop notes</h2>
                <p className="mt-1 whitespace-pre-line text-ink-950">{job.notes}</p>
              </div>
            ) : null}
          </Panel>
          <JobItemsPanel jobId={job.id} items={job.items} canEdit={office} />
          {job.stage !== "inquiry" || office ? <JobPlanSummary jobId={job.id} /> : null}
          <JobChangeOrdersPanel jobId={job.id} canEdit={office} labourRateCents={settings.data?.labourRateCents ?? 0} />
          <JobBoothSummary jobId={job.id} paths={{ booth: paths.booth(job.id), prep: paths.jobPrep(job.id), ticket: paths.jobTicket(job.id) }} />
          <JobFinishRecordPanel job={job} canRepeat={office} />
          <JobColourPanel jobId={job.id} canApprove={office} panelHref={paths.panel} newPanelHref={paths.newPanel(job.id)} />
          <Panel>
            <PhotoPanel owner={{ ownerType: "job", ownerId: job.id }} listJobId={job.id} title="Job photos" canShare canDeleteAll={office} currentUserId={user.id} />
          </Panel>
        </div>
        <div className="flex flex-col gap-6 self-start">
          {office ? <JobQuotesPanel jobId={job.id} canCreate={job.stage !== "cancelled"} /> : null}
          {office ? <JobMessagesPanel jobId={job.id} stage={job.stage} /> : null}
          <StageHistory events={job.events} />
        </div>
      </div>
      {dialog === "edit" ? <EditJobDialog job={job} onClose={() => setDialog(null)} /> : null}
      {dialog === "delete" ? (
        <DeleteJobDialog job={job} onClose={() => setDialog(null)} onDeleted={() => navigate(paths.jobs, { replace: true })} />
      ) : null}
    </>
  );
}

function EditJobDialog({ job, onClose }: { job: JobDetailDto; onClose: () => void }) {
  const painters = useQuery(userQueries.painters());
  const update = useUpdateJob(job.id);
  const painterOptions = painters.data ?? [];
  const painterList =
    job.assignedPainterId && !painterOptions.some((p) => p.id === job.assignedPainterId)
      ? [{ id: job.assignedPainterId, name: `${job.assignedPainterName ?? "Former painter"} (inactive)` }, ...painterOptions]
      : painterOptions;

  return (
    <Dialog title={`Edit job #${job.id}`} onClose={onClose} size="lg">
      {painters.isPending ? (
        <Spinner />
      ) : (
        <JobForm
          customerSearch={customerQueries.search}
          customerName={job.customerName}
          painters={painterList}
          defaultValues={{
            customerId: String(job.customerId),
            title: job.title,
            dueDate: job.dueDate,
            assignedPainterId: job.assignedPainterId,
            notes: job.notes ?? "",
          }}
          submitLabel="Save job"
          onCancel={onClose}
          onSubmit={async (values) => {
            await update.mutateAsync({ ...values, version: job.version });
            toast.success("Job saved");
            onClose();
          }}
        />
      )}
    </Dialog>
  );
}
