import { useQuery } from "@tanstack/react-query";
import { Plus } from "lucide-react";
import { roleCan } from "@shared/domain/roles";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { paths } from "@/config/paths";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { JobsTable } from "@/features/jobs/components/jobs-table";
import { userQueries } from "@/features/users/api/users.queries";
import { authQueries } from "@/features/auth/api/auth.queries";
import { jobQueries } from "@/features/jobs/api/jobs.queries";
import { readJobListParams } from "@/features/jobs/hooks/use-job-list-params";
import type { RouteModule } from "@/app/router";

/** The table's page for this URL (and the painter filter's list, for the office) start loading with the screen. */
export const prefetch: RouteModule["prefetch"] = (queryClient, { request }) => {
  void queryClient.prefetchQuery(jobQueries.list(readJobListParams(new URL(request.url).searchParams).query));
  const user = queryClient.getQueryData(authQueries.me().queryKey);
  if (user && roleCan(user.role, "office")) void queryClient.prefetchQuery(userQueries.painters());
};

export default function JobsRoute() {
  const user = useCurrentUser();
  const office = roleCan(user.role, "office");
  const painters = useQuery({ ...userQueries.painters(), enabled: office });
  const newJob = office ? (
    <ButtonLink to={paths.newJob} icon={<Plus aria-hidden className="size-5" />}>
      New job
    </ButtonLink>
  ) : null;
  return (
    <>
      <PageHeader
        title="Jobs"
        description={office ? "Search, filter and sort every job." : "The jobs assigned to you."}
        actions={newJob}
      />
      <JobsTable painters={office ? (painters.data ?? []) : undefined} emptyAction={newJob} />
    </>
  );
}
