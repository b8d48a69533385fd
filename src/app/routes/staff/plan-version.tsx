import { Link } from "react-router";
import { useIdParam } from "@/hooks/use-id-param";
import { useQuery } from "@tanstack/react-query";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { formatDateTime } from "@/utils/format-date";
import { planQueries } from "@/features/plans/api/plans.queries";
import { PlanLayersView } from "@/features/plans/components/plan-layers-view";
import { InPageNotFound } from "../in-page-not-found";

/** One stored version of a plan, read-only: what was (or would be) sprayed. */
export default function PlanVersionRoute() {
  const planParam = useIdParam("planId");
  const versionParam = useIdParam("versionId");
  const [id, vid, valid] = [planParam.id, versionParam.id, planParam.valid && versionParam.valid];
  const plan = useQuery({ ...planQueries.detail(id), enabled: valid });
  const version = useQuery({ ...planQueries.version(id, vid), enabled: valid });
  if (!valid || (isApiError(version.error) && [400, 404].includes(version.error.status))) return <InPageNotFound what="Plan version" backTo={paths.plans} backLabel="Back to plans" />;
  if (version.isPending || !version.data) return <Spinner label="Loading the version…" />;
  const v = version.data;
  return (
    <>
      <PageHeader
        documentTitle={`${plan.data?.name ?? "Plan"} v${v.version}`}
        eyebrow={<Link to={paths.plan(id)} className="underline underline-offset-2">{plan.data?.name ?? "Plan"}</Link>}
        title={`Version ${v.version}`}
        description={`Saved ${formatDateTime(v.createdAt)}${v.createdByName ? ` by ${v.createdByName}` : ""}${v.note ? ` · ${v.note}` : ""}`}
      />
      {v.frozenAt ? (
        <Alert tone="info" title="Used at the booth" className="mb-4">
          First used {formatDateTime(v.frozenAt)}. This version never changes; edits make a new version.
        </Alert>
      ) : null}
      <PlanLayersView layers={v.layers} />
    </>
  );
}
