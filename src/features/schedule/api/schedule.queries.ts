import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { BoothDto, BoothInput, SchedulableJobDto, ScheduleDto, SuggestionDto } from "@shared/schemas/schedule.schema";

export const scheduleKeys = {
  all: ["schedule"] as const,
  range: (from: string, to: string) => [...scheduleKeys.all, "range", from, to] as const,
  jobs: () => [...scheduleKeys.all, "jobs"] as const,
  booths: () => ["booths"] as const,
};

export const scheduleQueries = {
  range: (from: string, to: string) =>
    queryOptions({ queryKey: scheduleKeys.range(from, to), queryFn: ({ signal }) => api.get<ScheduleDto>(`/schedule?${new URLSearchParams({ from, to })}`, { signal }) }),
  jobs: () => queryOptions({ queryKey: scheduleKeys.jobs(), queryFn: ({ signal }) => api.get<SchedulableJobDto[]>("/schedule/jobs", { signal }) }),
  booths: () => queryOptions({ queryKey: scheduleKeys.booths(), queryFn: ({ signal }) => api.get<BoothDto[]>("/booths", { signal }), staleTime: 60_000 }),
};

/** Anything on the schedule changed: every range and the list of jobs to book refetch. */
function useAfterChange() {
  const queryClient = useQueryClient();
  return () => Promise.all([queryClient.invalidateQueries({ queryKey: scheduleKeys.all }), queryClient.invalidateQueries({ queryKey: scheduleKeys.booths() })]);
}

export function useBookSession() {
  const after = useAfterChange();
  return useMutation({ mutationFn: (input: { boothId: number; jobId: number; layerId: number; startsAt: string }) => api.post<ScheduleDto>("/schedule/sessions", input), onSuccess: after });
}

export function useMoveSession() {
  const after = useAfterChange();
  return useMutation({ mutationFn: ({ id, ...input }: { id: number; version: number; boothId?: number; startsAt?: string }) => api.patch<ScheduleDto>(`/schedule/sessions/${id}`, input), onSuccess: after });
}

export function useRemoveSession() {
  const after = useAfterChange();
  return useMutation({ mutationFn: (id: number) => api.delete<void>(`/schedule/sessions/${id}`), onSuccess: after });
}

export function useSetPrepPlan() {
  const after = useAfterChange();
  return useMutation({ mutationFn: ({ jobId, readyAt }: { jobId: number; readyAt: string | null }) => api.put<SchedulableJobDto | null>(`/schedule/jobs/${jobId}/prep`, { readyAt }), onSuccess: after });
}

export function useSuggest() {
  return useMutation({ mutationFn: (input: { from?: string; horizonDays?: number }) => api.post<SuggestionDto>("/schedule/suggest", input) });
}

export function useAcceptSuggestion() {
  const after = useAfterChange();
  return useMutation({
    mutationFn: (s: SuggestionDto) => api.post<ScheduleDto>("/schedule/accept", { from: s.from, sessions: s.sessions.map(({ boothId, jobId, layerId, startsAt }) => ({ boothId, jobId, layerId, startsAt })) }),
    onSuccess: after,
  });
}

export function useCreateBooth() {
  const after = useAfterChange();
  return useMutation({ mutationFn: (input: BoothInput) => api.post<BoothDto>("/booths", input), onSuccess: after });
}

export function useUpdateBooth() {
  const after = useAfterChange();
  return useMutation({ mutationFn: ({ id, ...input }: Partial<BoothInput> & { id: number; version: number }) => api.patch<BoothDto>(`/booths/${id}`, input), onSuccess: after });
}
