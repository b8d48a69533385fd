import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { PaymentDto, RefundInput } from "@shared/schemas/payment.schema";

export type PaymentListParams = { quoteId?: number; jobId?: number; flagged?: "1" };

export const paymentKeys = {
  all: ["payments"] as const,
  lists: () => [...paymentKeys.all, "list"] as const,
  list: (params: PaymentListParams) => [...paymentKeys.lists(), params] as const,
};

export const paymentQueries = {
  /** Payments (those waiting for the owner first), for one quote or job or the whole shop. */
  list: (params: PaymentListParams) =>
    queryOptions({
      queryKey: paymentKeys.list(params),
      queryFn: ({ signal }) => api.get<{ items: PaymentDto[] }>("/payments", { query: params, signal }),
      // A deposit arrives by webhook at any moment; keep the office's view fresh.
      refetchInterval: 30_000,
    }),
};

/** Refunds a payment (all that is left, or part) through the provider; the refund is recorded from its webhook. */
export function useRefundPayment() {
  const queryClient = useQueryClient();
  const refresh = () => queryClient.invalidateQueries({ queryKey: paymentKeys.all });
  return useMutation({
    mutationFn: ({ paymentId, ...input }: RefundInput & { paymentId: number }) =>
      api.post<{ status: "requested"; amountCents: number; message: string }>(`/payments/${paymentId}/refund`, input),
    onSuccess: () => {
      // The provider's webhook records the refund a moment later: look again shortly.
      window.setTimeout(() => void refresh(), 1500);
      return refresh();
    },
  });
}

/** The owner accepts a flagged payment: it counts towards the deposit and books the job. */
export function useAcceptPayment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ paymentId, note }: { paymentId: number; note?: string }) => api.post<PaymentDto>(`/payments/${paymentId}/accept`, { note }),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: paymentKeys.all }),
        queryClient.invalidateQueries({ queryKey: ["quotes"] }),
        queryClient.invalidateQueries({ queryKey: ["jobs"] }),
      ]),
  });
}
