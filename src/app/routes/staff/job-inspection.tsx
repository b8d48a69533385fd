import { useQuery } from "@tanstack/react-query";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { EmptyState } from "@/components/ui/empty-state";
import { paths } from "@/config/paths";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { jobQueries } from "@/features/jobs/api/jobs.queries";
import { intakeQueries } from "@/features/intake/api/intake.queries";
import { InspectionForm } from "@/features/intake/components/inspection-form";
import { PrepSuggestion } from "@/features/intake/components/prep-suggestion";
import { PhotoPanel } from "@/features/uploads/components/photo-panel";
import { formatDateTime } from "@/utils/format-date";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

/** The estimator inspects each item before quoting; the inspection suggests the prep line for the quote. */
export default function JobInspectionRoute() {
  const { id, valid } = useIdParam("jobId");
  const user = useCurrentUser();
  const job = useQuery({ ...jobQueries.detail(id), enabled: valid });
  const inspection = useQuery({ ...intakeQueries.inspection(id), enabled: valid });
  if (!valid || (isApiError(inspection.error) && (inspection.error.status === 404 || inspection.error.status === 400)))
    return <InPageNotFound what="Job" backTo={paths.jobs} backLabel="Back to jobs" />;
  if (inspection.error) return <Alert tone="error">{inspection.error.message}</Alert>;
  if (!inspection.data) return <Spinner label="Loading the inspection…" />;
  const data = inspection.data;
  return (
    <>
      <PageHeader
        eyebrow={<span className="tabular-nums">Job #{id}</span>}
        title={`Intake inspection${job.data ? `: ${job.data.title}` : ""}`}
        documentTitle={`Inspection · job #${id}`}
        description={
          data.exists
            ? `Inspected by ${data.inspectedByName ?? "a former user"}, ${formatDateTime(data.inspectedAt)}.`
            : "Look each item over before quoting: its condition, the area as measured, how the existing finish takes a solvent."
        }
        actions={
          <ButtonLink to={paths.job(id)} variant="secondary" size="lg">
            Job page
          </ButtonLink>
        }
      />
      {data.items.length === 0 ? (
        <EmptyState title="This job has no items to inspect">Add the parts to paint on the job page first.</EmptyState>
      ) : (
        <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
          <InspectionForm
            key={data.version === 0 ? "new" : "saved"}
            inspection={data}
            photos={(ownerId, itemName) => (
              <PhotoPanel owner={{ ownerType: "inspection_item", ownerId }} title={`Photos of ${itemName}`} canShare canDeleteAll currentUserId={user.id} compact />
            )}
          />
          <div className="self-start xl:sticky xl:top-4">
            <PrepSuggestion inspection={data} quoteHref={paths.quote} />
          </div>
        </div>
      )}
    </>
  );
}
