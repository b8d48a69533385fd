import { keepPreviousData, queryOptions, useMutation, useQueryClient, type QueryClient } from "@tanstack/react-query";
import { api, apiUrl } from "@/lib/api-client";
import type { Page } from "@shared/api/pagination";
import type { JobMessageDto } from "@shared/schemas/message.schema";
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

