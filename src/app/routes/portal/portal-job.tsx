import { Link } from "react-router";
import { useQuery } from "@tanstack/react-query";
import type { Stage } from "@shared/domain/stages";
import { isApiError } from "@/lib/api-client";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { StageBadge } from "@/features/jobs/components/stage-badge";
import { portalQueries } from "@/features/portal/api/portal.queries";
import { PortalJobDetails } from "@/features/portal/components/portal-job-details";
import { ApprovedColour } from "@/features/portal/components/approved-colour";
import { PortalColourChoice } from "@/features/portal/components/portal-colour-choice";
import { PortalJobChanges } from "@/features/change-orders/components/portal-job-changes";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

/** Stages from which the job has a finish record to read. */
const SPRAYED: readonly Stage[] = ["in_booth", "curing", "finishing", "ready", "delivered"];

export default function PortalJobRoute() {
  const { id, valid } = useIdParam("jobId");
  const { data, error, isPending } = useQuery({ ...portalQueries.job(id), enabled: valid });
  if (!valid || (isApiError(error) && (error.status === 404 || error.status === 400))) return <InPageNotFound what="Job" backTo={paths.portal} backLabel="Back to my jobs" />;
  if (isPending || !data) return <Spinner label="Loading your job…" />;
  return (
    <>
      <PageHeader eyebrow={`Job #${data.id}`} title={data.title} actions={<StageBadge stage={data.stage as Stage} size="lg" />} />
      <div className="mb-6 flex flex-col gap-3">
        <PortalJobChanges jobId={data.id} hrefOf={paths.portalChangeOrder} />
        <PortalColourChoice jobId={data.id} />
        <ApprovedColour jobId={data.id} />
      </div>
      <PortalJobDetails job={data} />
      {SPRAYED.includes(data.stage as Stage) ? (
        <p className="mt-6">
          <Link to={paths.portalFinishRecord(data.id)} className="inline-flex min-h-12 items-center text-lg font-semibold text-candy-700 underline underline-offset-2">
            What was sprayed: the finish record
          </Link>
        </p>
      ) : null}
    </>
  );
}
