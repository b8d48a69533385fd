import { queryOptions, useMutation, useQueryClient, type QueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import { newEntryKey, offlineQueue } from "@/lib/offline/queue";
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

/** What a coat or a correction changes besides the card: the job's stage and the plan's frozen state. */
const afterCoat = (jobId: number) => [boothKeys.card(jobId), ["jobs"], ["plans"]] as const;

/** Sent at once: the answer is the new card. (Sent later from the queue, src/app/offline.ts does the same.) */
function afterSent(queryClient: QueryClient, jobId: number, sent: { queued: true } | { queued: false; answer: unknown }) {
  if (sent.queued) return;
  queryClient.setQueryData(boothKeys.card(jobId), sent.answer as BoothDto);
  return Promise.all([queryClient.invalidateQueries({ queryKey: ["jobs"] }), queryClient.invalidateQueries({ queryKey: ["plans"] })]);
}

/**
 * One tap: the coat goes into the tablet's queue with its own key and the time it was made (on the server's clock,
 * from the card's offset), and is sent at once when the server can be reached. Offline it waits, and the card moves
 * on over it (booth-overlay.ts). Resolves `queued` or with the server's answer (already put in the cache).
 */
export function useLogCoat(card: BoothDto, clockOffsetMs: number) {
  const queryClient = useQueryClient();
  const jobId = card.job.id;
  return useMutation({
    networkMode: "always",
    mutationFn: (input: Omit<CreateCoatLogInput, "jobId">) => {
      const madeAt = Date.now() + clockOffsetMs;
      const layer = card.layers.find((l) => l.id === input.layerId);
      return offlineQueue.submit({
        key: newEntryKey(),
        kind: "coat",
        jobId,
        path: "/coat-logs",
        body: { ...input, jobId, at: new Date(madeAt).toISOString() },
        madeAt,
        label: `Coat ${input.coatNumber} of ${layer?.name ?? "the layer"}`,
        answerKey: boothKeys.card(jobId),
        refresh: [...afterCoat(jobId)],
      });
    },
    onSuccess: (sent) => afterSent(queryClient, jobId, sent),
    // A refused tap (stale card, prep) means the card on screen is out of date.
    onError: () => queryClient.invalidateQueries({ queryKey: boothKeys.card(jobId) }),
  });
}

/** A correction goes through the same queue (its `at`, when given, is the coat's corrected time). */
export function useCorrectCoat(jobId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    networkMode: "always",
    mutationFn: ({ id, label, ...input }: CorrectCoatLogInput & { id: number; label: string }) =>
      offlineQueue.submit({
        key: newEntryKey(),
        kind: "correction",
        jobId,
        path: `/coat-logs/${id}/corrections`,
        body: input,
        madeAt: Date.now(),
        label,
        answerKey: boothKeys.card(jobId),
        refresh: [...afterCoat(jobId)],
      }),
    onSuccess: (sent) => afterSent(queryClient, jobId, sent),
    onError: () => queryClient.invalidateQueries({ queryKey: boothKeys.card(jobId) }),
  });
}
