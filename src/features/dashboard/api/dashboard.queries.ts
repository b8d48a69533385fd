import { queryOptions } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { DashboardDto } from "@shared/schemas/dashboard.schema";

export const dashboardKeys = {
  all: ["dashboard"] as const,
};

export const dashboardQueries = {
  /** Every widget's figures in one answer; `money` is null unless the owner asks. */
  summary: () =>
    queryOptions({
      queryKey: dashboardKeys.all,
      queryFn: ({ signal }) => api.get<DashboardDto>("/dashboard", { signal }),
      staleTime: 60_000,
    }),
};
