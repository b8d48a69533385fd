import { useMemo } from "react";
import { OPEN_STAGES, STAGES, type Stage } from "@shared/domain/stages";
import { JOB_SORT_FIELDS } from "@shared/schemas/job.schema";
import { useListSearchParams } from "@/hooks/use-list-search-params";
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

/** The jobs list's state, read from and written to the URL: ?q=&stage=a,b|all&due=&painter=&customer=&sort=&page=&pageSize= */
export function useJobListParams() {
  const list = useListSearchParams({ sortFields: JOB_SORT_FIELDS, defaultSort: "dueDate" });
  const { searchParams } = list;
  const stageParam = searchParams.get("stage") ?? "";
  const dueParam = searchParams.get("due") ?? "";
  const painterId = searchParams.get("painter") ?? "";
  const customerParam = Number.parseInt(searchParams.get("customer") ?? "", 10);
  const customerId = customerParam > 0 ? customerParam : undefined;

  // No ?stage= means open work only (the usual view); ?stage=all lifts the stage filter.
  const stages = useMemo<Stage[]>(() => {
    if (stageParam === "") return [...OPEN_STAGES];
    if (stageParam === ALL) return [];
    return stageParam.split(",").filter((s): s is Stage => (STAGES as readonly string[]).includes(s));
  }, [stageParam]);
  const due: DueFilter = dueParam === "overdue" || dueParam === "week" ? dueParam : "";

  const query: JobListParams = useMemo(
    () => ({
      page: list.page,
      pageSize: list.pageSize,
      sort: list.sort,
      ...(list.q ? { q: list.q } : {}),
      ...(stages.length ? { stage: stages } : {}),
      ...(due ? { due } : {}),
      ...(painterId ? { painterId } : {}),
      ...(customerId ? { customerId } : {}),
    }),
    [list.page, list.pageSize, list.sort, list.q, stages, due, painterId, customerId],
  );

  const filtered = Boolean(list.q || stageParam || due || painterId || customerId);
  return { ...list, stages, due, painterId, customerId, query, filtered };
}
