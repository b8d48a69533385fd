import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { CreateMixSheetInput, MixSheetDto, MixSheetSummaryDto, RecordMixSheetInput, VoidMixSheetInput } from "@shared/schemas/mix-sheet.schema";
import { materialKeys } from "@/features/materials/api/materials.queries";
import { planKeys } from "./plans.queries";

export const mixSheetKeys = {
  all: ["mix-sheets"] as const,
  lists: () => [...mixSheetKeys.all, "list"] as const,
  forJob: (jobId: number) => [...mixSheetKeys.lists(), { jobId }] as const,
  detail: (id: number) => [...mixSheetKeys.all, "detail", id] as const,
};

export const mixSheetQueries = {
  forJob: (jobId: number) =>
    queryOptions({ queryKey: mixSheetKeys.forJob(jobId), queryFn: ({ signal }) => api.get<MixSheetSummaryDto[]>("/mix-sheets", { query: { jobId }, signal }) }),
  detail: (id: number) => queryOptions({ queryKey: mixSheetKeys.detail(id), queryFn: ({ signal }) => api.get<MixSheetDto>(`/mix-sheets/${id}`, { signal }) }),
};

/**
 * A sheet write: its detail is replaced and the job's list refetched. Recording also takes stock (the materials
 * catalogue refetches) and freezes the plan version (plans refetch).
 */
function useAfterSheetWrite() {
  const queryClient = useQueryClient();
  return (sheet: MixSheetDto | undefined, { stock = false }: { stock?: boolean } = {}) => {
    if (sheet) queryClient.setQueryData(mixSheetKeys.detail(sheet.id), sheet);
    return Promise.all([
      queryClient.invalidateQueries({ queryKey: mixSheetKeys.lists() }),
      ...(stock ? [queryClient.invalidateQueries({ queryKey: materialKeys.all }), queryClient.invalidateQueries({ queryKey: planKeys.all })] : []),
    ]);
  };
}

export function useCreateMixSheet() {
  const after = useAfterSheetWrite();
  return useMutation({ mutationFn: (input: CreateMixSheetInput) => api.post<MixSheetDto>("/mix-sheets", input), onSuccess: (s) => after(s, { stock: true }) });
}

export function useRecordMixSheet(id: number) {
  const after = useAfterSheetWrite();
  return useMutation({ mutationFn: (input: RecordMixSheetInput) => api.post<MixSheetDto>(`/mix-sheets/${id}/record`, input), onSuccess: (s) => after(s, { stock: true }) });
}

export function useVoidMixSheet(id: number) {
  const after = useAfterSheetWrite();
  return useMutation({ mutationFn: (input: VoidMixSheetInput) => api.post<MixSheetDto>(`/mix-sheets/${id}/void`, input), onSuccess: (s) => after(s) });
}

export function useDeleteMixSheet() {
  const queryClient = useQueryClient();
  const after = useAfterSheetWrite();
  return useMutation({
    mutationFn: (id: number) => api.delete(`/mix-sheets/${id}`),
    onSuccess: (_d, id) => {
      queryClient.removeQueries({ queryKey: mixSheetKeys.detail(id) });
      return after(undefined, { stock: true });
    },
  });
}
