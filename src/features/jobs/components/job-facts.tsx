import type { ReactNode } from "react";
import { Link } from "react-router";
import type { JobDetailDto } from "@shared/schemas/job.schema";
import { paths } from "@/config/paths";
import { formatDate, formatDateTime } from "@/utils/format-date";
import { DueDate, dueStatus } from "./due-date";

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5">
      <dt className="text-xs font-semibold tracking-wide text-primer-700 uppercase">{term}</dt>
      <dd className="text-base text-ink-950">{children}</dd>
    </div>
  );
}

/** Customer, due date, painter and dates of a job. The customer links to their record for the office. */
export function JobFacts({ job, linkCustomer }: { job: JobDetailDto; linkCustomer: boolean }) {
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-4 sm:grid-cols-4">
      <Fact term="Customer">
        {linkCustomer ? (
          <Link to={paths.customer(job.customerId)} className="font-semibold text-candy-700 underline-offset-2 hover:underline">
            {job.customerName}
          </Link>
        ) : (
          job.customerName
        )}
      </Fact>
      <Fact term="Due">
        {job.dueDate ? (
          <span className="flex flex-col items-start gap-1">
            {formatDate(job.dueDate)}
            {dueStatus(job.dueDate, job.stage) !== "later" ? <DueDate dueDate={job.dueDate} stage={job.stage} className="text-sm" /> : null}
          </span>
        ) : (
          <span className="text-primer-700">No due date</span>
        )}
      </Fact>
      <Fact term="Painter">{job.assignedPainterName ?? <span className="text-primer-700">Not assigned</span>}</Fact>
      <Fact term="In this stage since">{formatDateTime(job.stageChangedAt)}</Fact>
    </dl>
  );
}
