import { keepPreviousData, queryOptions, useMutation, useQueryClient, type QueryClient } from "@tanstack/react-query";
import { api, apiUrl } from "@/lib/api-client";
import type { Page } from "@shared/api/pagination";
import type { JobMessageDto } from "@shared/schemas/message.schema";
import type { PaymentDto, RefundInput } from "@shared/schemas/payment.schema";
import type { QuoteDetailDto, QuoteDto, QuoteStatus, QuoteVersionDto, SendQuoteInput, UpdateQuoteInput } from "@shared/schemas/quote.schema";

export type QuoteListParams = {
  page?: number;
  pageSize?: number;
  q?: string;
  sort?: string;
  status?: QuoteStatus;
  jobId?: number;
};

export const quoteKeys = {
  all: ["quotes"] as const,
  lists: () => [...quoteKeys.all, "list"] as const,
  list: (params: QuoteListParams) => [...quoteKeys.lists(), params] as const,
  details: () => [...quoteKeys.all, "detail"] as const,
  detail: (id: number) => [...quoteKeys.details(), id] as const,
  version: (id: number, version: number) => [...quoteKeys.detail(id), "version", version] as const,
};
export const messageKeys = { job: (jobId: number) => ["messages", jobId] as const };
export const paymentKeys = {
  all: ["payments"] as const,
  forQuote: (quoteId: number) => [...paymentKeys.all, "quote", quoteId] as const,
  flagged: () => [...paymentKeys.all, "flagged"] as const,
};

export const quoteQueries = {
  list: (params: QuoteListParams) =>
    queryOptions({
      queryKey: quoteKeys.list(params),
      queryFn: ({ signal }) => api.get<Page<QuoteDto>>("/quotes", { query: params, signal }),
      placeholderData: keepPreviousData,
    }),
  detail: (id: number) =>
    queryOptions({
      queryKey: quoteKeys.detail(id),
      queryFn: ({ signal }) => api.get<QuoteDetailDto>(`/quotes/${id}`, { signal }),
    }),
  version: (id: number, version: number) =>
    queryOptions({
      queryKey: quoteKeys.version(id, version),
      queryFn: ({ signal }) => api.get<QuoteVersionDto>(`/quotes/${id}/versions/${version}`, { signal }),
      staleTime: 5 * 60_000,
    }),
  messages: (jobId: number) =>
    queryOptions({
      queryKey: messageKeys.job(jobId),
      queryFn: ({ signal }) => api.get<{ items: JobMessageDto[] }>("/messages", { query: { jobId }, signal }),
    }),
  payments: (quoteId: number) =>
    queryOptions({
      queryKey: paymentKeys.forQuote(quoteId),
      queryFn: ({ signal }) => api.get<{ items: PaymentDto[] }>("/payments", { query: { quoteId }, signal }),
      // A deposit arrives by webhook at any moment; keep the office's view fresh.
      refetchInterval: 30_000,
    }),
  flaggedPayments: () =>
    queryOptions({
      queryKey: paymentKeys.flagged(),
      queryFn: ({ signal }) => api.get<{ items: PaymentDto[] }>("/payments", { query: { flagged: "1" }, signal }),
    }),
};

export const quotePdfUrl = (id: number, version?: number) => apiUrl(`/quotes/${id}/pdf`, version ? { version } : undefined);

function afterQuoteWrite(queryClient: QueryClient, quote?: QuoteDetailDto) {
  if (quote) queryClient.setQueryData(quoteKeys.detail(quote.id), quote);
  return Promise.all([
    queryClient.invalidateQueries({ queryKey: quoteKeys.lists() }),
    quote ? queryClient.invalidateQueries({ queryKey: messageKeys.job(quote.jobId) }) : null,
    // Sending can move a job from inquiry to quoted.
    queryClient.invalidateQueries({ queryKey: ["jobs"] }),
  ]);
}

export function useCreateQuote() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (jobId: number) => api.post<QuoteDetailDto>("/quotes", { jobId }),
    onSuccess: (quote) => afterQuoteWrite(queryClient, quote),
  });
}

export function useUpdateQuote(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateQuoteInput) => api.patch<QuoteDetailDto>(`/quotes/${id}`, input),
    onSuccess: (quote) => afterQuoteWrite(queryClient, quote),
  });
}

export function useReviseQuote(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<QuoteDetailDto>(`/quotes/${id}/versions`),
    onSuccess: (quote) => afterQuoteWrite(queryClient, quote),
  });
}

export function useFillMaterials(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<QuoteDetailDto>(`/quotes/${id}/fill-materials`),
    onSuccess: (quote) => afterQuoteWrite(queryClient, quote),
  });
}

export function useDiscardDraft(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete<{ deleted: "quote" | "version" }>(`/quotes/${id}`),
    onSuccess: async (result) => {
      if (result.deleted === "quote") queryClient.removeQueries({ queryKey: quoteKeys.detail(id) });
      else await queryClient.invalidateQueries({ queryKey: quoteKeys.detail(id) });
      await afterQuoteWrite(queryClient);
    },
  });
}

export function useSendQuote(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SendQuoteInput) => api.post<QuoteDetailDto>(`/quotes/${id}/send`, input),
    onSuccess: (quote) => afterQuoteWrite(queryClient, quote),
    // A failed send is logged on the job too.
    onError: () => queryClient.invalidateQueries({ queryKey: ["messages"] }),
  });
}

export function useSendReadyNotice(jobId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<JobMessageDto>("/messages/ready-notice", { jobId }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: messageKeys.job(jobId) }),
  });
}

export function useRefundPayment(quoteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ paymentId, ...input }: RefundInput & { paymentId: number }) =>
      api.post<{ status: "requested"; amountCents: number; message: string }>(`/payments/${paymentId}/refund`, input),
    onSuccess: () => {
      // The refund is recorded when the provider's webhook arrives: look again shortly.
      window.setTimeout(() => void queryClient.invalidateQueries({ queryKey: paymentKeys.forQuote(quoteId) }), 1500);
      return queryClient.invalidateQueries({ queryKey: paymentKeys.forQuote(quoteId) });
    },
  });
}

export function useAcceptPayment(quoteId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ paymentId, note }: { paymentId: number; note?: string }) => api.post<PaymentDto>(`/payments/${paymentId}/accept`, { note }),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: paymentKeys.all }),
        queryClient.invalidateQueries({ queryKey: quoteKeys.detail(quoteId) }),
        queryClient.invalidateQueries({ queryKey: ["jobs"] }),
      ]),
  });
}
