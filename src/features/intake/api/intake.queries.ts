import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { quoteKeys } from "@/features/quotes/api/quotes.queries";
import type { AddPrepLineInput, InspectionDto, SaveInspectionInput } from "@shared/schemas/inspection.schema";
import type { QuoteDetailDto } from "@shared/schemas/quote.schema";

export const intakeKeys = {
  all: ["intake"] as const,
  inspection: (jobId: number) => [...intakeKeys.all, "inspection", jobId] as const,
};

export const intakeQueries = {
  /** The job's intake inspection (an empty one at version 0 before the first save). */
  inspection: (jobId: number) =>
    queryOptions({ queryKey: intakeKeys.inspection(jobId), queryFn: ({ signal }) => api.get<InspectionDto>(`/jobs/${jobId}/inspection`, { signal }) }),
};

export function useSaveInspection(jobId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveInspectionInput) => api.put<InspectionDto>(`/jobs/${jobId}/inspection`, input),
    onSuccess: (saved) => queryClient.setQueryData(intakeKeys.inspection(jobId), saved),
  });
}

/** Puts the suggested prep line on the job's quote (or starts one): the inspection and the quotes both change. */
export function useAddPrepLine(jobId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AddPrepLineInput) => api.post<QuoteDetailDto>(`/jobs/${jobId}/inspection/prep-line`, input),
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: intakeKeys.inspection(jobId) }), queryClient.invalidateQueries({ queryKey: quoteKeys.all })]),
  });
}
