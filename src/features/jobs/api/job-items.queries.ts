import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { CreateJobItemInput, UpdateJobItemInput } from "@shared/schemas/job-item.schema";
import type { JobItemDto } from "@shared/schemas/job.schema";
import { jobKeys } from "./jobs.queries";

/** Items are read as part of the job detail; a write refreshes that detail and the lists (item counts). */
function useAfterItemWrite(jobId: number) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: jobKeys.detail(jobId) }),
      queryClient.invalidateQueries({ queryKey: jobKeys.lists() }),
    ]);
}

export function useCreateJobItem(jobId: number) {
  const refresh = useAfterItemWrite(jobId);
  return useMutation({
    mutationFn: (input: CreateJobItemInput) => api.post<JobItemDto>(`/jobs/${jobId}/items`, input),
    onSuccess: refresh,
  });
}

export function useUpdateJobItem(jobId: number) {
  const refresh = useAfterItemWrite(jobId);
  return useMutation({
    mutationFn: ({ itemId, ...input }: UpdateJobItemInput & { itemId: number }) =>
      api.patch<JobItemDto>(`/jobs/${jobId}/items/${itemId}`, input),
    onSuccess: refresh,
  });
}

export function useDeleteJobItem(jobId: number) {
  const refresh = useAfterItemWrite(jobId);
  return useMutation({
    mutationFn: (itemId: number) => api.delete(`/jobs/${jobId}/items/${itemId}`),
    onSuccess: refresh,
  });
}
