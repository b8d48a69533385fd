import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { ChangeOrderDto } from "@shared/schemas/change-order.schema";
import type { ApproveQuoteInput, DeclineQuoteInput } from "@shared/schemas/quote.schema";
import type { CheckoutDto } from "@shared/schemas/payment.schema";

/** `token` is the signed quote link from the e-mail (for a customer who has not signed in); it is part of each key. */
const withToken = (token?: string | null) => (token ? { token } : undefined);

export const portalChangeOrderKeys = {
  all: ["portal-change-orders"] as const,
  detail: (id: number, token?: string | null) => [...portalChangeOrderKeys.all, "detail", id, token ?? null] as const,
  job: (jobId: number, token?: string | null) => [...portalChangeOrderKeys.all, "job", jobId, token ?? null] as const,
};

export const portalChangeOrderQueries = {
  /** One change order as the customer sees it; polls after a card payment until the webhook has recorded it. */
  detail: (id: number, token?: string | null, options: { waitForPayment?: boolean } = {}) =>
    queryOptions({
      queryKey: portalChangeOrderKeys.detail(id, token),
      queryFn: ({ signal }) => api.get<ChangeOrderDto>(`/portal/change-orders/${id}`, { query: withToken(token), signal }),
      retry: false,
      refetchInterval: (query) => {
        const m = query.state.data?.money;
        return options.waitForPayment && m && m.paidCents < m.depositCents ? 2000 : false;
      },
    }),
  job: (jobId: number, token?: string | null) =>
    queryOptions({
      queryKey: portalChangeOrderKeys.job(jobId, token),
      queryFn: ({ signal }) => api.get<{ items: ChangeOrderDto[] }>(`/portal/jobs/${jobId}/change-orders`, { query: withToken(token), signal }),
    }),
};

type Decision = ({ decision: "approve" } & ApproveQuoteInput) | ({ decision: "decline" } & DeclineQuoteInput);

/** The customer's answer; the answer replaces the cached change order. */
export function useDecideChangeOrder(id: number, token?: string | null) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ decision, ...input }: Decision) => api.post<ChangeOrderDto>(`/portal/change-orders/${id}/${decision}`, input, { query: withToken(token) }),
    onSuccess: (dto) => {
      queryClient.setQueryData(portalChangeOrderKeys.detail(id, token), dto);
      return queryClient.invalidateQueries({ queryKey: portalChangeOrderKeys.job(dto.jobId, token) });
    },
  });
}

/** Starts the hosted checkout for the extra deposit; the caller sends the browser to the returned address. */
export function useChangeOrderCheckout(id: number, token?: string | null) {
  return useMutation({ mutationFn: () => api.post<CheckoutDto>(`/portal/change-orders/${id}/checkout`, {}, { query: withToken(token) }) });
}
