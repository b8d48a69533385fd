import { useEffect } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { Link } from "react-router";
import { ChevronRight, SprayCan } from "lucide-react";
import { STAGE_LABELS } from "@shared/domain/stages";
import { Alert } from "@/components/ui/alert";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { jobQueries } from "@/features/jobs/api/jobs.queries";
import { boothQueries } from "@/features/booth/api/booth.queries";
import { BoothDay } from "@/features/schedule/components/booth-day";
import { formatDate } from "@/utils/format-date";
import { BOOTH_JOB_LIST } from "../../offline-keys";

/** The jobs at the booth (in prep, in the booth, curing): painters see theirs, the owner all. Big tap targets. */
export default function BoothIndexRoute() {
  const user = useCurrentUser();
  const jobs = useQuery(jobQueries.list(BOOTH_JOB_LIST));
  // A painter's tablet fetches every card of the list now, so each one opens in the booth with no Wi-Fi (the cards
  // are kept on the tablet: src/app/offline.ts), even one not opened yet.
  const queryClient = useQueryClient();
  const painter = user.role === "painter";
  useEffect(() => {
    if (painter && jobs.data) for (const job of jobs.data.items) void queryClient.prefetchQuery(boothQueries.card(job.id));
  }, [painter, jobs.data, queryClient]);
  return (
    <>
      <PageHeader title="Booth" description={user.role === "painter" ? "Your jobs in prep, in the booth and curing. Tap one to open its booth card." : "Jobs in prep, in the booth and curing."} />
      <BoothDay mine={user.role === "painter"} />
      {jobs.isPending ? (
        <Spinner label="Loading jobs…" />
      ) : jobs.error ? (
        <Alert tone="error">{jobs.error.message}</Alert>
      ) : jobs.data.items.length === 0 ? (
        <EmptyState icon={<SprayCan aria-hidden />} title="No jobs at the booth right now" />
      ) : (
        <ul className="grid gap-3 md:grid-cols-2">
          {[...jobs.data.items]
            .sort((a, b) => ["in_booth", "in_prep", "curing"].indexOf(a.stage) - ["in_booth", "in_prep", "curing"].indexOf(b.stage))
            .map((job) => (
              <li key={job.id}>
                <Link
                  to={paths.booth(job.id)}
                  className="flex min-h-24 items-center gap-4 rounded-2xl border-2 border-primer-300 bg-white px-5 py-4 shadow-card active:bg-primer-100"
                >
                  <div className="min-w-0 flex-1">
                    <p className="text-sm font-semibold text-primer-800">
                      #{job.id} · {STAGE_LABELS[job.stage]}
                      {job.dueDate ? ` · due ${formatDate(job.dueDate)}` : ""}
                    </p>
                    <p className="text-xl font-semibold text-ink-950">{job.title}</p>
                    <p className="text-base text-primer-800">{job.customerName}</p>
                  </div>
                  <ChevronRight aria-hidden className="size-8 shrink-0 text-primer-600" />
                </Link>
              </li>
            ))}
        </ul>
      )}
    </>
  );
}
