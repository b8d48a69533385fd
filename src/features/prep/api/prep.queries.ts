import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { newEntryKey, offlineQueue } from "@/lib/offline/queue";
import type { CreatePrepRecordInput, JobPrepDto, PrepRecordDto, UpdatePrepRecordInput } from "@shared/schemas/prep.schema";

export const prepKeys = {
  all: ["prep"] as const,
  job: (jobId: number) => [...prepKeys.all, "job", jobId] as const,
};

export const prepQueries = {
  job: (jobId: number) =>
    queryOptions({
      queryKey: prepKeys.job(jobId),
      queryFn: ({ signal }) => api.get<JobPrepDto>("/prep-records", { query: { jobId }, signal }),
    }),
};

/** Any prep change: the job's prep list and its booth card (prep status gates the first coat). */
function useAfterPrep(jobId: number) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([queryClient.invalidateQueries({ queryKey: prepKeys.job(jobId) }), queryClient.invalidateQueries({ queryKey: ["booth", "card", jobId] })]);
}

export function useSavePrep(jobId: number) {
  const after = useAfterPrep(jobId);
  return useMutation({
    mutationFn: ({ id, ...input }: (CreatePrepRecordInput | UpdatePrepRecordInput) & { id?: number }) =>
      id ? api.patch<PrepRecordDto>(`/prep-records/${id}`, input) : api.post<PrepRecordDto>("/prep-records", input),
    onSuccess: after,
  });
}

/** A sign-off goes through the tablet's queue (src/lib/offline/queue.ts) with the time it was made: it works offline. */
export function useSignOffPrep(jobId: number) {
  const after = useAfterPrep(jobId);
  return useMutation({
    networkMode: "always",
    mutationFn: ({ id, label }: { id: number; label: string }) =>
      offlineQueue.submit({
        key: newEntryKey(),
        kind: "sign-off",
        jobId,
        path: `/prep-records/${id}/sign-off`,
        body: { at: new Date().toISOString() },
        madeAt: Date.now(),
        label,
        refresh: [prepKeys.job(jobId), ["booth", "card", jobId]],
      }),
    onSuccess: (sent) => (sent.queued ? undefined : after()),
  });
}

export function useReopenPrep(jobId: number) {
  const after = useAfterPrep(jobId);
  return useMutation({ mutationFn: ({ id, reason }: { id: number; reason: string }) => api.post<PrepRecordDto>(`/prep-records/${id}/reopen`, { reason }), onSuccess: after });
}
