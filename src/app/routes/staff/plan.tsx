import { useState } from "react";
import { Link, useNavigate } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { Copy, Lock, Pencil, Trash2 } from "lucide-react";
import { roleCan } from "@shared/domain/roles";
import type { PlanDto } from "@shared/schemas/plan.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button, ButtonLink } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { Spinner } from "@/components/ui/spinner";
import { TextField } from "@/components/ui/form/text-field";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { formatDateTime } from "@/utils/format-date";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { planQueries, useCopyAsTemplate, useDeletePlan } from "@/features/plans/api/plans.queries";
import { PlanLayersView } from "@/features/plans/components/plan-layers-view";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";

export default function PlanRoute() {
  const { id, valid } = useIdParam("planId");
  const { data, error, isPending } = useQuery({ ...planQueries.detail(id), enabled: valid });
  if (!valid || (isApiError(error) && (error.status === 404 || error.status === 400))) return <InPageNotFound what="Plan" backTo={paths.plans} backLabel="Back to plans" />;
  if (isPending || !data) return <Spinner label="Loading the plan…" />;
  return <PlanPage plan={data} />;
}

function PlanPage({ plan }: { plan: PlanDto }) {
  const user = useCurrentUser();
  const office = roleCan(user.role, "office");
  const versions = useQuery(planQueries.versions(plan.id));
  const [dialog, setDialog] = useState<"copy" | "delete" | null>(null);
  return (
    <>
      <PageHeader
        documentTitle={plan.name}
        eyebrow={plan.isTemplate ? "Template" : plan.jobId ? <Link to={paths.job(plan.jobId)} className="underline underline-offset-2">Job #{plan.jobId}: {plan.jobTitle}</Link> : "Plan"}
        title={plan.name}
        description={plan.description ?? undefined}
        actions={
          office ? (
            <>
              <ButtonLink to={`${paths.plan(plan.id)}/edit`} icon={<Pencil aria-hidden className="size-4" />}>
                Edit plan
              </ButtonLink>
              {!plan.isTemplate ? (
                <Button variant="secondary" onClick={() => setDialog("copy")} icon={<Copy aria-hidden className="size-4" />}>
                  Save as template
                </Button>
              ) : null}
              <Button variant="danger" onClick={() => setDialog("delete")} icon={<Trash2 aria-hidden className="size-4" />}>
                Delete
              </Button>
            </>
          ) : plan.jobId ? (
            <ButtonLink variant="secondary" to={paths.jobPlan(plan.jobId)}>
              Job plan and mix sheets
            </ButtonLink>
          ) : null
        }
      />
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_20rem]">
        <section aria-labelledby="latest-heading" className="flex min-w-0 flex-col gap-3">
          <h2 id="latest-heading" className="flex items-center gap-2 text-lg font-semibold">
            Version {plan.latest.version}
            {plan.latest.frozenAt ? (
              <span className="inline-flex items-center gap-1 rounded-full bg-ink-900 px-2 py-0.5 text-xs font-semibold text-white">
                <Lock aria-hidden className="size-3" /> Sprayed
              </span>
            ) : null}
          </h2>
          {plan.latest.note ? <p className="text-sm text-primer-700">{plan.latest.note}</p> : null}
          <PlanLayersView layers={plan.latest.layers} />
        </section>
        <Panel title="Versions" titleId="versions-heading" className="self-start">
          {versions.isPending ? (
            <Spinner />
          ) : (
            <ol className="flex flex-col gap-2" aria-labelledby="versions-heading">
              {(versions.data ?? []).map((v) => (
                <li key={v.id}>
                  <Link to={paths.planVersion(plan.id, v.id)} className="block rounded-lg border border-primer-200 px-3 py-2 hover:bg-primer-50">
                    <span className="flex items-center gap-2 font-semibold">
                      Version {v.version}
                      {v.sprayed ? <span className="rounded-full bg-candy-100 px-2 py-0.5 text-xs text-candy-900">Sprayed with</span> : v.locked ? <Lock aria-label="Locked" className="size-3.5" /> : null}
                    </span>
                    <span className="block text-xs text-primer-700">
                      {formatDateTime(v.createdAt)}
                      {v.createdByName ? ` · ${v.createdByName}` : ""} · {v.layerCount} layers
                    </span>
                    {v.note ? <span className="block text-xs text-ink-900">{v.note}</span> : null}
                  </Link>
                </li>
              ))}
            </ol>
          )}
        </Panel>
      </div>
      {dialog === "copy" ? <CopyDialog plan={plan} onClose={() => setDialog(null)} /> : null}
      {dialog === "delete" ? <DeleteDialog plan={plan} onClose={() => setDialog(null)} /> : null}
    </>
  );
}

function CopyDialog({ plan, onClose }: { plan: PlanDto; onClose: () => void }) {
  const copy = useCopyAsTemplate(plan.id);
  const navigate = useNavigate();
  const [name, setName] = useState(`${plan.name} (template)`);
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <Dialog title="Save as a template" onClose={onClose}>
      <form
        className="flex flex-col gap-4"
        onSubmit={async (e) => {
          e.preventDefault();
          try {
            const t = await copy.mutateAsync({ name });
            toast.success("Template saved");
            navigate(paths.plan(t.id));
          } catch (error) {
            setProblem(isApiError(error) ? error.message : "Could not save the template.");
          }
        }}
      >
        {problem ? <Alert tone="error">{problem}</Alert> : null}
        <TextField label="Template name" value={name} onChange={(e) => setName(e.target.value)} />
        <div className="flex gap-3">
          <Button type="submit" size="lg" pending={copy.isPending}>
            Save template
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Cancel
          </Button>
        </div>
      </form>
    </Dialog>
  );
}

function DeleteDialog({ plan, onClose }: { plan: PlanDto; onClose: () => void }) {
  const remove = useDeletePlan();
  const navigate = useNavigate();
  return (
    <ConfirmDialog
      title={`Delete ${plan.name}?`}
      confirmLabel="Delete plan"
      keepLabel="Keep it"
      pending={remove.isPending}
      failure="Could not delete the plan."
      onConfirm={async () => {
        await remove.mutateAsync(plan.id);
        return "Plan deleted";
      }}
      onDone={() => navigate(plan.jobId ? paths.job(plan.jobId) : paths.plans, { replace: true })}
      onClose={onClose}
    >
      Only a plan that was never used at the booth can be deleted.
    </ConfirmDialog>
  );
}
