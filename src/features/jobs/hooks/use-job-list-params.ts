import { useMemo } from "react";
import { OPEN_STAGES, STAGES, type Stage } from "@shared/domain/stages";
import { JOB_SORT_FIELDS } from "@shared/schemas/job.schema";
import { readListParams, useListSearchParams } from "@/hooks/use-list-search-params";
import type { JobListParams } from "../api/jobs.queries";

export type DueFilter = "" | "overdue" | "week";

const ALL = "all";

/** The ?stage= value for a chosen set of stages: nothing for the default (open stages), "all" for no filter. */
export function stageParamFor(stages: readonly Stage[]): string | null {
  if (stages.length === 0 || stages.length === STAGES.length) return ALL;
  const sorted = STAGES.filter((s) => stages.includes(s));
  if (sorted.length === OPEN_STAGES.length && sorted.every((s) => OPEN_STAGES.includes(s))) return null;
  return sorted.join(",");
}

const LIST_OPTIONS = { sortFields: JOB_SORT_FIELDS, defaultSort: "dueDate" } as const;

/** The jobs list's filters and the API query they make, from its URL (also used to fetch ahead of the screen). */
export function readJobListParams(searchParams: URLSearchParams) {
  const list = readListParams(searchParams, LIST_OPTIONS);
  const stageParam = searchParams.get("stage") ?? "";
  const dueParam = searchParams.get("due") ?? "";
  const painterId = searchParams.get("painter") ?? "";
  const customerParam = Number.parseInt(searchParams.get("customer") ?? "", 10);
  const customerId = customerParam > 0 ? customerParam : undefined;

  // No ?stage= means open work only (the usual view); ?stage=all lifts the stage filter.
  const stages: Stage[] =
    stageParam === "" ? [...OPEN_STAGES] : stageParam === ALL ? [] : stageParam.split(",").filter((s): s is Stage => (STAGES as readonly string[]).includes(s));
  const due: DueFilter = dueParam === "overdue" || dueParam === "week" ? dueParam : "";

  const query: JobListParams = {
    page: list.page,
    pageSize: list.pageSize,
    sort: list.sort,
    ...(list.q ? { q: list.q } : {}),
    ...(stages.length ? { stage: stages } : {}),
    ...(due ? { due } : {}),
    ...(painterId ? { painterId } : {}),
    ...(customerId ? { customerId } : {}),
  };
  const filtered = Boolean(list.q || stageParam || due || painterId || customerId);
  return { stages, due, painterId, customerId, query, filtered };
}

/** The jobs list's state, read from and written to the URL: ?q=&stage=a,b|all&due=&painter=&customer=&sort=&page=&pageSize= */
export function useJobListParams() {
  const list = useListSearchParams(LIST_OPTIONS);
  const key = list.searchParams.toString();
  // Recomputed only when the URL changes, so the query and the stage list keep their identity between renders.
  const filters = useMemo(() => readJobListParams(new URLSearchParams(key)), [key]);
  return { ...list, ...filters };
}
