import { Link } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { ListChecks } from "lucide-react";
import { EmptyState } from "@/components/ui/empty-state";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { jobQueries } from "../api/jobs.queries";
import { DueDate } from "./due-date";
import { StageBadge } from "./stage-badge";

const LIMIT = 50;

/** A short list of one customer's jobs, most recently changed first. */
export function CustomerJobList({ customerId }: { customerId: number }) {
  const { data, isPending } = useQuery(jobQueries.list({ customerId, sort: "-updatedAt", pageSize: LIMIT }));
  if (isPending) return <Spinner label="Loading jobs…" />;
  if (!data || data.items.length === 0)
    return <EmptyState icon={<ListChecks aria-hidden />} title="No jobs for this customer yet" className="border-0" />;
  return (
    <div className="flex flex-col gap-3">
      <ul className="divide-y divide-primer-100">
        {data.items.map((job) => (
          <li key={job.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-1 py-3">
            <div className="min-w-0">
              <Link to={paths.job(job.id)} className="font-semibold text-ink-950 hover:text-candy-700 hover:underline">
                <span className="text-primer-600">#{job.id}</span> {job.title}
              </Link>
              <div className="mt-0.5 text-sm">
                <DueDate dueDate={job.dueDate} stage={job.stage} />
              </div>
            </div>
            <StageBadge stage={job.stage} />
          </li>
        ))}
      </ul>
      {data.total > data.items.length ? (
        <Link to={`${paths.jobs}?customer=${customerId}&stage=all`} className="text-sm font-semibold text-candy-700 hover:underline">
          All {data.total} jobs in the jobs table
        </Link>
      ) : null}
    </div>
  );
}
