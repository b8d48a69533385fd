import { useMemo } from "react";
import { STAGES, type Stage } from "@shared/domain/stages";
import { JOB_SORT_FIELDS } from "@shared/schemas/job.schema";
import { useListSearchParams } from "@/hooks/use-list-search-params";
import type { JobListParams } from "../api/jobs.queries";

export type DueFilter = "" | "overdue" | "week";

/** The jobs list's state, read from and written to the URL: ?q=&stage=a,b&due=&painter=&customer=&sort=&page=&pageSize= */
export function useJobListParams() {
  const list = useListSearchParams({ sortFields: JOB_SORT_FIELDS, defaultSort: "dueDate" });
  const { searchParams } = list;
  const stageParam = searchParams.get("stage") ?? "";
  const dueParam = searchParams.get("due") ?? "";
  const painterId = searchParams.get("painter") ?? "";
  const customerParam = Number.parseInt(searchParams.get("customer") ?? "", 10);
  const customerId = customerParam > 0 ? customerParam : undefined;

  const stages = useMemo(
    () => stageParam.split(",").filter((s): s is Stage => (STAGES as readonly string[]).includes(s)),
    [stageParam],
  );
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

  const filtered = Boolean(list.q || stages.length || due || painterId || customerId);
  return { ...list, stages, due, painterId, customerId, query, filtered };
}
