import { useQuery } from "@tanstack/react-query";
import { PaintBucket } from "lucide-react";
import { isClosedStage } from "@shared/domain/stages";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { portalQueries } from "@/features/portal/api/portal.queries";
import { PortalJobCard } from "@/features/portal/components/portal-job-card";

export default function MyJobsRoute() {
  const user = useCurrentUser();
  // The portal's own API: every job of this customer with its parts, most recently changed first, in one request.
  const { data, isPending } = useQuery(portalQueries.jobs());
  const firstName = user.name.split(" ")[0];
  const jobs = data?.items ?? [];
  const current = jobs.filter((j) => !isClosedStage(j.stage));
  const past = jobs.filter((j) => isClosedStage(j.stage));

  return (
    <>
      <PageHeader title="My jobs" description={`Hello ${firstName}. Here is where your work stands in the shop.`} />
      {isPending ? (
        <Spinner label="Loading your jobs…" />
      ) : jobs.length === 0 ? (
        <EmptyState icon={<PaintBucket aria-hidden />} title="No jobs yet">
          When the shop takes on work for you, it shows up here with its progress.
        </EmptyState>
      ) : (
        <div className="flex flex-col gap-8">
          {current.length ? (
            <section aria-labelledby="current-heading" className="flex flex-col gap-4">
              <h2 id="current-heading" className="text-lg font-semibold text-ink-950">
                In the shop ({current.length})
              </h2>
              {current.map((job) => (
                <PortalJobCard key={job.id} job={job} />
              ))}
            </section>
          ) : null}
          {past.length ? (
            <section aria-labelledby="past-heading" className="flex flex-col gap-4">
              <h2 id="past-heading" className="text-lg font-semibold text-ink-950">
                Finished ({past.length})
              </h2>
              {past.map((job) => (
                <PortalJobCard key={job.id} job={job} />
              ))}
            </section>
          ) : null}
        </div>
      )}
    </>
  );
}
