import { useParams } from "react-router";
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
import { InPageNotFound } from "../in-page-not-found";

export default function PortalJobRoute() {
  const { jobId } = useParams();
  const id = Number(jobId);
  const valid = Number.isInteger(id) && id > 0;
  const { data, error, isPending } = useQuery({ ...portalQueries.job(id), enabled: valid });
  if (!valid || (isApiError(error) && (error.status === 404 || error.status === 400))) return <InPageNotFound what="Job" backTo={paths.portal} backLabel="Back to my jobs" />;
  if (isPending || !data) return <Spinner label="Loading your job…" />;
  return (
    <>
      <PageHeader eyebrow={`Job #${data.id}`} title={data.title} actions={<StageBadge stage={data.stage as Stage} size="lg" />} />
      <PortalJobDetails job={data} />
      <div className="mt-6">
        <ApprovedColour jobId={data.id} />
      </div>
    </>
  );
}
