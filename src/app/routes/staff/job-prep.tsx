import { useQuery } from "@tanstack/react-query";
import { SprayCan } from "lucide-react";
import { roleCan } from "@shared/domain/roles";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { jobQueries } from "@/features/jobs/api/jobs.queries";
import { prepQueries } from "@/features/prep/api/prep.queries";
import { PrepItemCard } from "@/features/prep/components/prep-item-card";
import { PhotoPanel } from "@/features/uploads/components/photo-panel";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

export default function JobPrepRoute() {
  const { id, valid } = useIdParam("jobId");
  const user = useCurrentUser();
  const job = useQuery({ ...jobQueries.detail(id), enabled: valid });
  const prep = useQuery({ ...prepQueries.job(id), enabled: valid });
  if (!valid || (isApiError(prep.error) && (prep.error.status === 404 || prep.error.status === 400)))
    return <InPageNotFound what="Job" backTo={paths.jobs} backLabel="Back to jobs" />;
  if (prep.error) return <Alert tone="error">{prep.error.message}</Alert>;
  if (!prep.data) return <Spinner label="Loading prep records…" />;
  const office = roleCan(user.role, "office");
  return (
    <>
      <PageHeader
        eyebrow={<span className="tabular-nums">Job #{id}</span>}
        title={`Prep${job.data ? `: ${job.data.title}` : ""}`}
        documentTitle={`Prep · job #${id}`}
        description={prep.data.allSignedOff ? "Every item is signed off: the booth card will take the first coat." : "Record each item's prep and sign it off before the first coat."}
        actions={
          <>
            <ButtonLink to={paths.booth(id)} size="lg" icon={<SprayCan aria-hidden className="size-5" />}>
              Booth card
            </ButtonLink>
            <ButtonLink to={paths.job(id)} variant="secondary" size="lg">
              Job page
            </ButtonLink>
          </>
        }
      />
      {prep.data.items.length === 0 ? (
        <EmptyState title="This job has no items to prep" />
      ) : (
        <div className="flex flex-col gap-5">
          {prep.data.items.map((item) => (
            <PrepItemCard
              key={item.itemId}
              jobId={id}
              item={item}
              canReopen={office}
              photos={item.record ? <PhotoPanel owner={{ ownerType: "prep_record", ownerId: item.record.id }} title="Prep photos" canShare canDeleteAll={office} currentUserId={user.id} compact /> : null}
            />
          ))}
        </div>
      )}
    </>
  );
}
