import { queryOptions, useMutation, useQueryClient, type QueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { BoothDto, CorrectCoatLogInput, CreateCoatLogInput, JobTicketDto } from "@shared/schemas/booth.schema";

export const boothKeys = {
  all: ["booth"] as const,
  card: (jobId: number) => [...boothKeys.all, "card", jobId] as const,
  ticket: (jobId: number) => [...boothKeys.all, "ticket", jobId] as const,
};

export const boothQueries = {
  /** The whole booth card. Refetched every 30 s so a batch mixed or a coat logged elsewhere shows up; timers tick locally. */
  card: (jobId: number) =>
    queryOptions({
      queryKey: boothKeys.card(jobId),
      queryFn: ({ signal }) => api.get<BoothDto>(`/jobs/${jobId}/booth`, { signal }),
      refetchInterval: 30_000,
    }),
  ticket: (jobId: number) =>
    queryOptions({
      queryKey: boothKeys.ticket(jobId),
      queryFn: ({ signal }) => api.get<JobTicketDto>(`/jobs/${jobId}/ticket`, { signal }),
      staleTime: 60_000,
    }),
};

/** A coat changes the card, maybe the job's stage, and the plan's frozen state: refresh what shows those. */
function afterCoat(queryClient: QueryClient, card: BoothDto) {
  queryClient.setQueryData(boothKeys.card(card.job.id), card);
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: ["jobs"] }),
    queryClient.invalidateQueries({ queryKey: ["plans"] }),
  ]);
}

export function useLogCoat(jobId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: Omit<CreateCoatLogInput, "jobId">) => api.post<BoothDto>("/coat-logs", { ...input, jobId }),
    onSuccess: (card) => afterCoat(queryClient, card),
    // A refused tap (stale card, prep) means the card on screen is out of date.
    onError: () => queryClient.invalidateQueries({ queryKey: boothKeys.card(jobId) }),
  });
}

export function useCorrectCoat(jobId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: CorrectCoatLogInput & { id: number }) => api.post<BoothDto>(`/coat-logs/${id}/corrections`, input),
    onSuccess: (card) => afterCoat(queryClient, card),
    onError: () => queryClient.invalidateQueries({ queryKey: boothKeys.card(jobId) }),
  });
}
