import type { QueryKey } from "@tanstack/react-query";
import type { JobListParams } from "@/features/jobs/api/jobs.queries";

/** The booth screen's list: the painter's jobs in prep, in the booth and curing (the server scopes it to theirs). */
export const BOOTH_JOB_LIST = { stage: ["in_booth", "in_prep", "curing"], sort: "stage", pageSize: 100 } satisfies JobListParams;

const isBoothList = (params: unknown) =>
  !!params && typeof params === "object" && JSON.stringify(params) === JSON.stringify(BOOTH_JOB_LIST);

/**
 * The queries a painter's tablet keeps for working offline, by their query keys (the factories in
 * features/auth, features/booth, features/prep, features/jobs and lib/server-status.queries): who is signed in, the
 * server's status line, the booth screen's job list, and each job's booth card and prep records. Nothing else is
 * written to the tablet: no other screen's answers, so no money and no other role's records
 * (tests/api/security/offline-cache.test.ts walks what would be kept).
 */
export function keepOnTablet(key: QueryKey): boolean {
  const [area, kind, arg] = key;
  if (area === "auth") return kind === "me";
  if (area === "server-status") return true;
  if (area === "booth") return kind === "card";
  if (area === "prep") return kind === "job";
  if (area === "jobs") return kind === "list" && isBoothList(arg);
  return false;
}
