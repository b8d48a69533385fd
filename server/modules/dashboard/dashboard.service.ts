import { sql } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { awaitsReviewFlag } from "../payments/payment-review";
import type { Actor } from "../../auth/session";
import { STAGES, type Stage } from "../../../shared/domain/stages";
import type { MaterialCategory } from "../../../shared/domain/materials";
import { systemPart } from "./system.service";
import type { DashboardDto, DashboardJobRef, DashboardJobsDto, DashboardMoneyDto } from "../../../shared/schemas/dashboard.schema";

/**
 * Every figure is computed from the records at request time, one query per widget, never stored twice.
 */
const DAY = 86_400_000;
const pad = (n: number) => String(n).padStart(2, "0");
const localDate = (ms: number) => {
  const d = new Date(ms);
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
};
/** The last 12 calendar months, oldest first, as YYYY-MM, and the epoch ms the window starts at. */
function last12Months(now: number) {
  const d = new Date(now);
  const months: string[] = [];
  for (let i = 11; i >= 0; i--) {
    const m = new Date(d.getFullYear(), d.getMonth() - i, 1);
    months.push(`${m.getFullYear()}-${pad(m.getMonth() + 1)}`);
  }
  return { months, startMs: new Date(d.getFullYear(), d.getMonth() - 11, 1).getTime() };
}

const OPEN = sql.raw(`('delivered','cancelled','ready')`);

function jobRefs(deps: AppDeps, where: ReturnType<typeof sql>): DashboardJobRef[] {
  return deps.db.all<DashboardJobRef>(sql`
    select j.id as id, j.title as title, c.name as customerName, j.stage as stage, j.due_date as dueDate
    from jobs j join customers c on c.id = j.customer_id
    where j.stage not in ${OPEN} and ${where}
    order by j.due_date, j.id limit 20`);
}

function jobsPart(deps: AppDeps): DashboardJobsDto {
  const counts = new Map(deps.db.all<{ stage: Stage; n: number }>(sql`select stage, count(*) as n from jobs group by stage`).map((r) => [r.stage, r.n]));
  const today = localDate(deps.now());
  const inAWeek = localDate(deps.now() + 7 * DAY);
  return {
    byStage: STAGES.map((stage) => ({ stage, count: counts.get(stage) ?? 0 })),
    dueThisWeek: jobRefs(deps, sql`j.due_date >= ${today} and j.due_date <= ${inAWeek}`),
    overdue: jobRefs(deps, sql`j.due_date < ${today}`),
  };
}

function moneyPart(deps: AppDeps): DashboardMoneyDto {
  const { months, startMs } = last12Months(deps.now());
  const monthExpr = (col: string) => sql.raw(`strftime('%Y-%m', ${col} / 1000, 'unixepoch', 'localtime')`);

  const deposits = deps.db.get<{ received: number; refunded: number; flagged: number }>(sql`
    select coalesce(sum(amount_cents), 0) as received, coalesce(sum(refunded_cents), 0) as refunded, coalesce(sum(${awaitsReviewFlag()}), 0) as flagged
    from payments`)!;

  // Approved quote versions (not superseded) whose quote has no payment yet.
  const outstanding = deps.db.get<{ cents: number; n: number }>(sql`
    select coalesce(sum(qv.deposit_cents), 0) as cents, count(*) as n
    from quote_versions qv join quotes q on q.id = qv.quote_id join jobs j on j.id = q.job_id
    where qv.status = 'approved' and qv.superseded_at is null and j.stage not in ('cancelled')
      and not exists (select 1 from payments p where p.quote_id = qv.quote_id)`)!;

  const depositsByMonth = new Map(
    deps.db
      .all<{ month: string; cents: number }>(sql`
        select ${monthExpr("paid_at")} as month, sum(amount_cents - refunded_cents) as cents
        from payments where paid_at >= ${startMs} group by month`)
      .map((r) => [r.month, r.cents]),
  );
  // A delivered job's value: the total of its latest approved quote version, in the month it was delivered.
  const deliveredByMonth = new Map(
    deps.db
      .all<{ month: string; cents: number }>(sql`
        select ${monthExpr("e.at")} as month, sum((
          select qv.total_cents from quote_versions qv join quotes q on q.id = qv.quote_id
          where q.job_id = e.job_id and qv.status = 'approved' order by qv.version desc limit 1)) as cents
        from job_stage_events e
        where e.to_stage = 'delivered' and e.at >= ${startMs}
          and e.id = (select max(e2.id) from job_stage_events e2 where e2.job_id = e.job_id and e2.to_stage = 'delivered')
        group by month`)
      .map((r) => [r.month, r.cents ?? 0]),
  );

  const materialSpendByCategory = deps.db.all<{ category: MaterialCategory; costCents: number }>(sql`
    select m.category as category, sum(coalesce(l.cost_cents, 0)) as costCents
    from mix_sheets ms join mix_sheet_lines l on l.mix_sheet_id = ms.id join materials m on m.id = l.material_id
    where ms.status = 'mixed' and ms.mixed_at >= ${startMs}
    group by m.category order by costCents desc`);

  // A coat counts unless a later entry corrects it; voiding entries themselves count nothing.
  const booth = deps.db.all<{ painterId: string | null; painterName: string | null; minutes: number; coats: number }>(sql`
    select c.painter_id as painterId, u.name as painterName, sum(pl.minutes_per_coat) as minutes, count(*) as coats
    from coat_logs c join plan_layers pl on pl.id = c.layer_id left join users u on u.id = c.painter_id
    where c.at >= ${deps.now() - 30 * DAY} and c.voids = 0
      and not exists (select 1 from coat_logs x where x.corrects_id = c.id)
    group by c.painter_id order by minutes desc`);

  return {
    deposits: {
      receivedCents: deposits.received,
      refundedCents: deposits.refunded,
      outstandingCents: outstanding.cents,
      outstandingQuotes: outstanding.n,
      flaggedPayments: deposits.flagged,
    },
    revenueByMonth: months.map((month) => ({ month, depositsCents: depositsByMonth.get(month) ?? 0, deliveredCents: deliveredByMonth.get(month) ?? 0 })),
    materialSpendByCategory,
    boothHoursByPainter: booth.map((b) => ({ painterId: b.painterId, painterName: b.painterName ?? "Former user", hours: b.minutes / 60, coats: b.coats })),
  };
}

/** The owner sees everything; the estimator the jobs part only. */
export function dashboard(deps: AppDeps, actor: Actor): DashboardDto {
  const owner = actor.role === "owner";
  return { generatedAt: new Date(deps.now()).toISOString(), jobs: jobsPart(deps), money: owner ? moneyPart(deps) : null, system: owner ? systemPart(deps) : null };
}
