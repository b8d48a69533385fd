import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { ChangeOrderDto, SendChangeOrderInput, UpdateChangeOrderInput } from "@shared/schemas/change-order.schema";

export const changeOrderKeys = {
  all: ["change-orders"] as const,
  job: (jobId: number) => [...changeOrderKeys.all, "job", jobId] as const,
  detail: (id: number) => [...changeOrderKeys.all, "detail", id] as const,
};

/** The shop's side; the customer's is in portal-change-orders.queries.ts, so the portal download stays apart. */
export const changeOrderQueries = {
  /** A job's change orders, newest first (painters get them without money). */
  job: (jobId: number) =>
    queryOptions({ queryKey: changeOrderKeys.job(jobId), queryFn: ({ signal }) => api.get<{ items: ChangeOrderDto[] }>(`/jobs/${jobId}/change-orders`, { signal }) }),
};

export function useUpdateChangeOrder(jobId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: UpdateChangeOrderInput & { id: number }) => api.patch<ChangeOrderDto>(`/change-orders/${id}`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: changeOrderKeys.job(jobId) }),
  });
}

export function useSendChangeOrder(jobId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...input }: SendChangeOrderInput & { id: number }) => api.post<ChangeOrderDto>(`/change-orders/${id}/send`, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: changeOrderKeys.job(jobId) }),
  });
}

