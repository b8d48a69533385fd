import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api, apiUrl } from "@/lib/api-client";
import { jobKeys } from "@/features/jobs/api/jobs.queries";
import { planKeys } from "@/features/plans/api/plans.queries";
import type { FinishRecordDto, RepeatFinishDto, RepeatFinishInput } from "@shared/schemas/finish-record.schema";

export const finishRecordKeys = {
  all: ["finish-record"] as const,
  detail: (jobId: number) => [...finishRecordKeys.all, jobId] as const,
};

export const finishRecordQueries = {
  detail: (jobId: number) =>
    queryOptions({ queryKey: finishRecordKeys.detail(jobId), queryFn: ({ signal }) => api.get<FinishRecordDto>(`/jobs/${jobId}/finish-record`, { signal }) }),
};

export const finishRecordPdfUrl = (jobId: number) => apiUrl(`/jobs/${jobId}/finish-record.pdf`);

/** Starts a new job from a recorded finish (a job's, or a test panel's); the job lists refetch. */
export function useRepeatFinish(from: { jobId: number } | { panelId: number }) {
  const queryClient = useQueryClient();
  const path = "jobId" in from ? `/jobs/${from.jobId}/repeat` : `/panels/${from.panelId}/repeat`;
  return useMutation({
    mutationFn: (input: RepeatFinishInput) => api.post<RepeatFinishDto>(path, input),
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: jobKeys.all }), queryClient.invalidateQueries({ queryKey: planKeys.all })]),
  });
}
