import { keepPreviousData, queryOptions } from "@tanstack/react-query";
import { api, apiUrl } from "@/lib/api-client";
import type { ComplianceDto, ComplianceQuery } from "@shared/schemas/compliance.schema";

export const complianceKeys = {
  all: ["compliance"] as const,
  log: (range: ComplianceQuery) => [...complianceKeys.all, "log", range] as const,
};

export const complianceQueries = {
  log: (range: ComplianceQuery) =>
    queryOptions({
      queryKey: complianceKeys.log(range),
      queryFn: ({ signal }) => api.get<ComplianceDto>("/compliance", { query: range, signal }),
      placeholderData: keepPreviousData,
    }),
};

/** The batch log as a CSV download for the same range (a plain link; the browser saves the file). */
export const complianceCsvUrl = (range: ComplianceQuery) => apiUrl("/compliance/export.csv", range);
