import { useNavigate, useParams } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { isApiError } from "@/lib/api-client";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { AccessGate } from "@/features/auth/components/access-gate";
import { materialQueries } from "@/features/materials/api/materials.queries";
import { planQueries, useCreateTemplate, useSavePlan } from "@/features/plans/api/plans.queries";
import { PlanEditor } from "@/features/plans/components/plan-editor";
import { InPageNotFound } from "../in-page-not-found";
import { idFrom } from "@/hooks/use-id-param";

/** /plans/new (a new template) and /plans/:planId/edit. */
export default function PlanEditRoute() {
  return (
    <AccessGate access="office">
      <PlanEditPage />
    </AccessGate>
  );
}

function PlanEditPage() {
  const { planId } = useParams();
  const isNew = planId === undefined;
  const { id, valid: validId } = idFrom(planId);
  const valid = isNew || validId;
  const plan = useQuery({ ...planQueries.detail(id), enabled: !isNew && valid });
  const materials = useQuery(materialQueries.list({}));
  if (!valid || (isApiError(plan.error) && [400, 404].includes(plan.error.status))) return <InPageNotFound what="Plan" backTo={paths.plans} backLabel="Back to plans" />;
  if ((!isNew && (plan.isPending || !plan.data)) || materials.isPending) return <Spinner label="Loading the editor…" />;
  return <Editor planId={isNew ? null : id} />;
}

function Editor({ planId }: { planId: number | null }) {
  const navigate = useNavigate();
  const plan = useQuery({ ...planQueries.detail(planId ?? 0), enabled: planId !== null });
  const materials = useQuery(materialQueries.list({}));
  const create = useCreateTemplate();
  const save = useSavePlan(planId ?? 0);
  const current = planId === null ? null : (plan.data ?? null);
  const back = () => navigate(current ? (current.jobId ? paths.jobPlan(current.jobId) : paths.plan(current.id)) : paths.plans);
  return (
    <>
      <PageHeader
        title={current ? `Edit ${current.name}` : "New template"}
        eyebrow={current?.jobTitle ? `Job #${current.jobId}: ${current.jobTitle}` : current ? "Template" : undefined}
        description="Each layer's mix is checked as you type; the mix engine's message shows beside the field."
      />
      <PlanEditor
        plan={current}
        materials={materials.data ?? []}
        submitLabel={current ? "Save plan" : "Create template"}
        onCancel={back}
        onSave={async (doc, version) => {
          const saved = current ? await save.mutateAsync({ ...doc, version }) : await create.mutateAsync(doc);
          toast.success(current && saved.latest.version > current.latest.version ? `Saved as version ${saved.latest.version}` : "Plan saved");
          navigate(saved.jobId ? paths.jobPlan(saved.jobId) : paths.plan(saved.id));
        }}
      />
    </>
  );
}
