import type { ReactNode } from "react";
import { Link } from "react-router";
import { Bar, BarChart, CartesianGrid, Legend, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { CalendarClock, CircleAlert } from "lucide-react";
import { STAGE_LABELS } from "@shared/domain/stages";
import { MATERIAL_CATEGORY_LABELS } from "@shared/domain/materials";
import { formatCents } from "@shared/quote/index";
import type { DashboardDto, DashboardJobRef, DashboardMoneyDto } from "@shared/schemas/dashboard.schema";
import { paths } from "@/config/paths";
import { formatDateTime, formatShortDate } from "@/utils/format-date";
import { formatNumber } from "@/utils/format-quantity";
import { ChartFigure } from "./chart-figure";
import { formatMonthLong, formatMonthShort } from "./format-month";
import { SystemStatus } from "./system-status";

// Theme colours (tailwind.config.ts): ink-600, candy-600, flake-600, emerald-700.
const INK = "#363f6b";
const CANDY = "#c0134f";
const FLAKE = "#ad7604";
const TEAL = "#0f766e";
const AXIS = { fontSize: 12, fill: "#48453f" };

/** Whole dollars for axis ticks: 123456 → "$1,235". */
const dollarsTick = (cents: number) => `$${formatNumber(Math.round(cents / 100), 0)}`;

export function DashboardView({ data }: { data: DashboardDto }) {
  return (
    <div className="flex flex-col gap-6">
      <p className="text-sm text-primer-700">Worked out from the records on {formatDateTime(data.generatedAt)}.</p>
      <JobsPart jobs={data.jobs} />
      {data.system ? <SystemStatus system={data.system} /> : null}
      {data.money ? <MoneyPart money={data.money} /> : null}
    </div>
  );
}

function JobsPart({ jobs }: { jobs: DashboardDto["jobs"] }) {
  const stages = jobs.byStage.map((s) => ({ ...s, label: STAGE_LABELS[s.stage] }));
  return (
    <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
      <ChartFigure
        testId="chart-jobs-by-stage"
        title="Jobs by stage"
        summary="Bar chart of the number of jobs in each stage"
        rows={stages}
        rowKey={(s) => s.stage}
        empty="No jobs yet."
        columns={[
          { header: "Stage", cell: (s) => s.label },
          { header: "Jobs", cell: (s) => s.count, numeric: true },
        ]}
      >
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={stages} margin={{ top: 8, right: 8, bottom: 8, left: 0 }} accessibilityLayer={false}>
            <CartesianGrid strokeDasharray="3 3" vertical={false} />
            <XAxis dataKey="label" tick={AXIS} interval={0} angle={-30} textAnchor="end" height={60} />
            <YAxis allowDecimals={false} tick={AXIS} width={32} />
            <Tooltip />
            <Bar dataKey="count" name="Jobs" fill={INK} radius={[4, 4, 0, 0]} isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </ChartFigure>
      <div className="flex flex-col gap-6">
        <JobList title="Overdue" icon={<CircleAlert aria-hidden className="size-5 text-red-800" />} jobs={jobs.overdue} empty="Nothing is overdue." />
        <JobList title="Due this week" icon={<CalendarClock aria-hidden className="size-5 text-flake-700" />} jobs={jobs.dueThisWeek} empty="Nothing else is due this week." />
      </div>
    </div>
  );
}

function JobList({ title, icon, jobs, empty }: { title: string; icon: ReactNode; jobs: DashboardJobRef[]; empty: string }) {
  const id = `dash-${title.toLowerCase().replace(/\W+/g, "-")}`;
  return (
    <section aria-labelledby={id} className="rounded-xl border border-primer-200 bg-white shadow-card">
      <h2 id={id} className="flex items-center gap-2 border-b border-primer-200 px-4 py-3 text-lg font-semibold text-ink-950 sm:px-5">
        {icon}
        {title}
        <span className="ml-auto rounded-full bg-primer-100 px-2.5 py-0.5 text-sm font-semibold text-primer-800">{jobs.length}</span>
      </h2>
      {jobs.length === 0 ? (
        <p className="px-4 py-4 text-sm text-primer-700 sm:px-5">{empty}</p>
      ) : (
        <ul className="divide-y divide-primer-100">
          {jobs.map((job) => (
            <li key={job.id}>
              <Link to={paths.job(job.id)} className="flex min-h-12 flex-wrap items-center gap-x-3 gap-y-0.5 px-4 py-2.5 hover:bg-primer-50 sm:px-5">
                <span className="min-w-0 flex-1 font-semibold text-ink-950">
                  {job.title}
                  <span className="block text-sm font-normal text-primer-700">
                    #{job.id} · {job.customerName} · {STAGE_LABELS[job.stage]}
                  </span>
                </span>
                <span className="text-sm font-medium whitespace-nowrap text-ink-900">{job.dueDate ? `Due ${formatShortDate(job.dueDate)}` : "No due date"}</span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function Figure({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <div className="rounded-xl border border-primer-200 bg-white px-4 py-3 shadow-card">
      <dt className="text-sm font-medium text-primer-700">{label}</dt>
      <dd className="mt-1 text-2xl font-bold tracking-tight text-ink-950 tabular-nums">{value}</dd>
      {note ? <dd className="text-sm text-primer-700">{note}</dd> : null}
    </div>
  );
}

function MoneyPart({ money }: { money: DashboardMoneyDto }) {
  const { deposits } = money;
  const revenue = money.revenueByMonth.map((m) => ({ ...m, label: formatMonthShort(m.month) }));
  const spend = money.materialSpendByCategory.map((c) => ({ ...c, label: MATERIAL_CATEGORY_LABELS[c.category] }));
  const hours = money.boothHoursByPainter.map((p) => ({ ...p, hours: Math.round(p.hours * 100) / 100 }));
  return (
    <>
      <section aria-labelledby="dash-deposits">
        <h2 id="dash-deposits" className="mb-3 text-lg font-semibold text-ink-950">
          Deposits
        </h2>
        <dl className="grid gap-4 sm:grid-cols-3">
          <Figure label="Received" value={formatCents(deposits.receivedCents)} />
          <Figure label="Refunded" value={formatCents(deposits.refundedCents)} />
          <Figure
            label="Outstanding"
            value={formatCents(deposits.outstandingCents)}
            note={`on ${deposits.outstandingQuotes} accepted ${deposits.outstandingQuotes === 1 ? "quote" : "quotes"}${deposits.flaggedPayments ? ` · ${deposits.flaggedPayments} payment${deposits.flaggedPayments === 1 ? "" : "s"} to check` : ""}`}
          />
        </dl>
      </section>
      <ChartFigure
        testId="chart-revenue"
        title="Revenue by month"
        summary="Bar chart of deposits received and delivered job value for each of the last 12 months"
        rows={revenue}
        rowKey={(m) => m.month}
        empty="No revenue in the last 12 months."
        columns={[
          { header: "Month", cell: (m) => formatMonthLong(m.month) },
          { header: "Deposits received (net of refunds)", cell: (m) => formatCents(m.depositsCents), numeric: true },
          { header: "Delivered job value", cell: (m) => formatCents(m.deliveredCents), numeric: true },
        ]}
      >
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={revenue} margin={{ top: 8, right: 8, bottom: 8, left: 8 }} accessibilityLayer={false}>
            <CartesianGrid strokeDasharray="3 3" vertical={false} />
            <XAxis dataKey="label" tick={AXIS} />
            <YAxis tickFormatter={dollarsTick} tick={AXIS} width={64} />
            <Tooltip formatter={(v) => formatCents(Number(v))} />
            <Legend />
            <Bar dataKey="depositsCents" name="Deposits" fill={CANDY} radius={[3, 3, 0, 0]} isAnimationActive={false} />
            <Bar dataKey="deliveredCents" name="Delivered value" fill={INK} radius={[3, 3, 0, 0]} isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </ChartFigure>
      <div className="grid gap-6 xl:grid-cols-2">
        <ChartFigure
          testId="chart-material-spend"
          title="Material spend by category"
          summary="Bar chart of the cost of material in recorded batches over the last 12 months, by category"
          rows={spend}
          rowKey={(c) => c.category}
          empty="No batches recorded in the last 12 months."
          columns={[
            { header: "Category", cell: (c) => c.label },
            { header: "Cost", cell: (c) => formatCents(c.costCents), numeric: true },
          ]}
        >
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={spend} layout="vertical" margin={{ top: 8, right: 16, bottom: 8, left: 8 }} accessibilityLayer={false}>
              <CartesianGrid strokeDasharray="3 3" horizontal={false} />
              <XAxis type="number" tickFormatter={dollarsTick} tick={AXIS} />
              <YAxis type="category" dataKey="label" tick={AXIS} width={130} />
              <Tooltip formatter={(v) => formatCents(Number(v))} />
              <Bar dataKey="costCents" name="Cost" fill={FLAKE} radius={[0, 3, 3, 0]} isAnimationActive={false} />
            </BarChart>
          </ResponsiveContainer>
        </ChartFigure>
        <ChartFigure
          testId="chart-booth-hours"
          title="Booth hours by painter"
          summary="Bar chart of spraying hours logged by each painter over the last 30 days"
          rows={hours}
          rowKey={(p) => p.painterId ?? "none"}
          empty="No coats logged in the last 30 days."
          columns={[
            { header: "Painter", cell: (p) => p.painterName },
            { header: "Hours (last 30 days)", cell: (p) => formatNumber(p.hours, 2), numeric: true },
            { header: "Coats logged", cell: (p) => p.coats, numeric: true },
          ]}
        >
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={hours} margin={{ top: 8, right: 8, bottom: 8, left: 0 }} accessibilityLayer={false}>
              <CartesianGrid strokeDasharray="3 3" vertical={false} />
              <XAxis dataKey="painterName" tick={AXIS} />
              <YAxis tick={AXIS} width={40} />
              <Tooltip formatter={(v) => `${formatNumber(Number(v), 2)} h`} />
              <Bar dataKey="hours" name="Hours" fill={TEAL} radius={[4, 4, 0, 0]} isAnimationActive={false} />
            </BarChart>
          </ResponsiveContainer>
        </ChartFigure>
      </div>
    </>
  );
}
