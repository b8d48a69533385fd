import { Link } from "react-router";
import { Check } from "lucide-react";
import { STAGE_LABELS, STAGES, type Stage } from "@shared/domain/stages";
import { SUBSTRATE_LABELS, type AreaUnit, type Substrate } from "@shared/domain/substrates";
import type { PortalJobDto } from "@shared/schemas/quote.schema";
import { cn } from "@/utils/cn";
import { paths } from "@/config/paths";
import { formatDate } from "@/utils/format-date";
// Display pieces shared with the staff screens (no queries, no staff screens behind them).
import { formatArea } from "@/features/jobs/components/item-area";
import { StageBadge } from "@/features/jobs/components/stage-badge";

/** What each stage means, told to the customer. */
const CUSTOMER_STAGE_TEXT: Record<Stage, string> = {
  inquiry: "We have your request and are working out a quote.",
  quoted: "Your quote is ready. Once you accept it and the deposit is in, we book the work.",
  booked: "Booked in. We are getting the materials ready.",
  in_prep: "Your parts are being stripped, sanded and cleaned for paint.",
  in_booth: "Your parts are in the spray booth.",
  curing: "The last coat is down and the finish is curing.",
  finishing: "Wet sanding, polishing and putting things back together.",
  ready: "Ready for you to collect.",
  delivered: "Collected. Thank you!",
  cancelled: "This job was cancelled.",
};

const JOURNEY = STAGES.filter((s) => s !== "cancelled");

function Progress({ stage }: { stage: Stage }) {
  if (stage === "cancelled") return null;
  const at = JOURNEY.indexOf(stage);
  return (
    <ol aria-label="Progress" className="flex gap-1">
      {JOURNEY.map((s, i) => (
        <li key={s} className="flex-1">
          <span className={cn("block h-2 rounded-full", i <= at ? "bg-candy-600" : "bg-primer-200")} aria-hidden />
          <span className="sr-only">
            {STAGE_LABELS[s]}: {i < at ? "done" : i === at ? "now" : "to come"}
          </span>
        </li>
      ))}
    </ol>
  );
}

/** One of the customer's jobs (from the portal's own API, parts included): where it is, when it is due, the parts. */
export function PortalJobCard({ job }: { job: PortalJobDto }) {
  const stage = job.stage as Stage;
  const headingId = `portal-job-${job.id}`;
  return (
    <article aria-labelledby={headingId} className="flex flex-col gap-4 rounded-2xl border border-primer-200 bg-white p-5 shadow-card">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <p className="text-sm font-medium text-primer-700">Job #{job.id}</p>
          <h3 id={headingId} className="text-lg leading-snug font-semibold text-ink-950">
            {job.title}
          </h3>
        </div>
        <StageBadge stage={stage} size="lg" />
      </div>
      <Progress stage={stage} />
      <p className="flex items-start gap-2 text-ink-900">
        {job.stage === "ready" || job.stage === "delivered" ? <Check aria-hidden className="mt-0.5 size-5 shrink-0 text-emerald-700" /> : null}
        {CUSTOMER_STAGE_TEXT[stage]}
      </p>
      {job.dueDate && job.stage !== "delivered" && job.stage !== "cancelled" ? (
        <p className="text-sm text-primer-700">
          Planned for <strong className="text-ink-950">{formatDate(job.dueDate)}</strong>
        </p>
      ) : null}
      <div>
        <h4 className="mb-2 text-sm font-semibold text-ink-950">Parts</h4>
        {job.items.length > 0 ? (
          <ul className="divide-y divide-primer-100 rounded-lg border border-primer-200">
            {job.items.map((item, i) => (
              <li key={i} className="flex flex-wrap items-baseline justify-between gap-x-3 px-3 py-2 text-sm">
                <span className="font-medium text-ink-950">{item.name}</span>
                <span className="text-primer-700">
                  {SUBSTRATE_LABELS[item.substrate as Substrate] ?? item.substrate} · {formatArea(item.surfaceArea, item.areaUnit as AreaUnit)}
                </span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-primer-700">The shop has not listed the parts yet.</p>
        )}
      </div>
      <Link to={paths.portalJob(job.id)} className="inline-flex min-h-11 items-center font-semibold text-candy-700 underline-offset-2 hover:underline">
        Photos, the finish and quotes<span className="sr-only"> for job #{job.id}</span>
      </Link>
    </article>
  );
}
