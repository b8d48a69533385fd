import type { DemoShop } from "../../support/demo-shop";

/** Ids to put into a route's path: one map per call, keyed by the route's parameter names. */
export type Params = Record<string, string | number>;
type Pair = { id: number | string; child: number | string };

/**
 * Records grouped by what a route's `:id` names (the path segment before it), limited to a set of jobs:
 * "foreign" pools hold records of other customers' jobs, "own" pools a painter's or customer's jobs.
 */
export function idPools(s: DemoShop, jobIds: number[]) {
  const jobsIn = `(${jobIds.join(",") || "-1"})`;
  const ids = (sql: string) => s.rows<{ id: number | string }>(sql).map((r) => r.id);
  const pairs = (sql: string) => s.rows<Pair>(sql);
  const uploadsOnJobs = ids(`select id from uploads where job_id in ${jobsIn} order by id`);
  const single: Record<string, (number | string)[]> = {
    jobs: jobIds,
    customers: ids(`select distinct customer_id as id from jobs where id in ${jobsIn}`),
    users: ids(`select id from users order by email`),
    materials: ids(`select id from materials order by id`),
    plans: ids(`select id from plans where job_id in ${jobsIn} order by id`),
    "mix-sheets": ids(`select id from mix_sheets where job_id in ${jobsIn} order by id`),
    uploads: uploadsOnJobs,
    "prep-records": ids(`select id from prep_records where job_id in ${jobsIn} order by id`),
    panels: ids(`select id from test_panels where job_id in ${jobsIn} order by id`),
    "coat-logs": ids(`select id from coat_logs where job_id in ${jobsIn} order by id`),
    quotes: ids(`select id from quotes where job_id in ${jobsIn} order by id`),
    payments: ids(`select id from payments where job_id in ${jobsIn} order by id`),
    inspections: ids(`select id from inspections where job_id in ${jobsIn} order by id`),
    "change-orders": ids(`select id from change_orders where job_id in ${jobsIn} order by id`),
    "panel-sign-offs": ids(`select distinct panel_id as id from panel_sign_offs where job_id in ${jobsIn} order by panel_id`),
    outbox: ["1"],
    photos: uploadsOnJobs,
  };
  const nested: Record<string, Pair[]> = {
    items: pairs(`select job_id as id, id as child from job_items where job_id in ${jobsIn} order by id`),
    lots: pairs(`select material_id as id, id as child from material_lots order by id`),
    files: pairs(`select owner_id as id, id as child from uploads where owner_type = 'material' order by id`),
    versions: pairs(`select plan_id as id, id as child from plan_versions where plan_id in (select id from plans where job_id in ${jobsIn}) order by id`),
    quoteVersions: pairs(`select quote_id as id, version as child from quote_versions where quote_id in (select id from quotes where job_id in ${jobsIn}) order by id`),
  };
  return { single, nested };
}
export type IdPools = ReturnType<typeof idPools>;

/** Up to `n` values spread over a list (first, middle, last…), so a sweep stays quick but not one-sided. */
export function spread<T>(list: T[], n = 3): T[] {
  if (list.length <= n) return list;
  if (n === 1) return [list[0]!];
  return Array.from({ length: n }, (_, i) => list[Math.round((i * (list.length - 1)) / (n - 1))]!);
}

/**
 * Parameter sets for a route path such as /api/jobs/:id/items/:itemId, drawn from `pools`. A nested child
 * is also tried under a parent from `parentPools` (e.g. another customer's item under one's own job).
 */
export function paramSets(routePath: string, pools: IdPools, parentPools?: IdPools, n = 3): Params[] {
  const segs = routePath.split("/");
  const names = segs.filter((x) => x.startsWith(":")).map((x) => x.slice(1));
  if (names.length === 0) return [{}];
  const resource = segs[segs.indexOf(":id") - 1]!;
  if (names.length === 1) return spread(pools.single[resource] ?? [], n).map((id) => ({ id }));
  const child = names[1]!;
  const key = child === "itemId" ? "items" : child === "lotId" ? "lots" : child === "fileId" ? "files" : child === "versionId" ? "versions" : child === "version" ? "quoteVersions" : null;
  if (child === "index") return spread(pools.single[resource] ?? [], 1).map((id) => ({ id, index: 0 }));
  const list = spread(pools.nested[key!] ?? [], n).map((p) => ({ id: p.id, [child]: p.child }));
  const mixed = parentPools ? spread(pools.nested[key!] ?? [], 1).flatMap((p) => spread(parentPools.single[resource] ?? [], 1).map((id) => ({ id, [child]: p.child }))) : [];
  return [...list, ...mixed];
}

export const fillPath = (routePath: string, p: Params) => routePath.replace(/:(\w+)/g, (_, name: string) => String(p[name]));
