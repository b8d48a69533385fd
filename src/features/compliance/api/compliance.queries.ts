import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api, apiUrl } from "@/lib/api-client";
import type { ComplianceDto, ComplianceQuery } from "@shared/schemas/compliance.schema";
import type { MaterialDto } from "@shared/schemas/material.schema";
import type { CreateSolventUseInput, SolventUseDto } from "@shared/schemas/solvent-use.schema";

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

/** Cleaners and reducers: what can be logged as solvent use. */
export const solventMaterialsQuery = () =>
  queryOptions({
    queryKey: [...complianceKeys.all, "solvent-materials"] as const,
    queryFn: async ({ signal }) => {
      const [cleaners, reducers] = await Promise.all(
        (["cleaner", "reducer"] as const).map((category) => api.get<MaterialDto[]>("/materials", { query: { category }, signal })),
      );
      return [...cleaners!, ...reducers!];
    },
    staleTime: 5 * 60_000,
  });

/** Logs prep or cleaning solvent; the VOC log of every range is refreshed. */
export function useLogSolventUse() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateSolventUseInput) => api.post<SolventUseDto>("/solvent-uses", input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: complianceKeys.all }),
  });
}
