import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { FinishRecordDto } from "@shared/schemas/finish-record.schema";
import { api, apiUrl } from "@/lib/api-client";
import type { JobColourDto } from "@shared/schemas/panel.schema";
import type { PortalColourDto } from "@shared/schemas/colour-sign-off.schema";
import type { CheckoutDto } from "@shared/schemas/payment.schema";
import type { ApproveQuoteInput, DeclineQuoteInput, PortalJobDto, PortalQuoteDto, PortalQuoteSummaryDto, PortalSessionDto } from "@shared/schemas/quote.schema";

/**
 * The customer portal's API. `token` is the signed quote link from the e-mail (for visitors who have not
 * signed in); it rides along as a query parameter, and each query key includes it.
 */
const withToken = (token?: string | null) => (token ? { token } : undefined);

export const portalKeys = {
  all: ["portal"] as const,
  session: (token?: string | null) => [...portalKeys.all, "session", token ?? null] as const,
  quotes: (token?: string | null) => [...portalKeys.all, "quotes", token ?? null] as const,
  quote: (id: number, token?: string | null) => [...portalKeys.all, "quote", id, token ?? null] as const,
  jobs: (token?: string | null) => [...portalKeys.all, "jobs", token ?? null] as const,
  job: (id: number, token?: string | null) => [...portalKeys.all, "job", id, token ?? null] as const,
  jobColour: (id: number) => [...portalKeys.all, "job", id, "colour"] as const,
  colourChoice: (id: number, token?: string | null) => [...portalKeys.all, "job", id, "colour-choice", token ?? null] as const,
  finishRecord: (id: number) => [...portalKeys.all, "job", id, "finish-record"] as const,
};

export const portalQueries = {
  session: (token?: string | null) =>
    queryOptions({
      queryKey: portalKeys.session(token),
      queryFn: ({ signal }) => api.get<PortalSessionDto>("/portal/session", { query: withToken(token), signal }),
      retry: false,
    }),
  quotes: (token?: string | null) =>
    queryOptions({
      queryKey: portalKeys.quotes(token),
      queryFn: ({ signal }) => api.get<{ items: PortalQuoteSummaryDto[] }>("/portal/quotes", { query: withToken(token), signal }),
    }),
  quote: (id: number, token?: string | null, options: { waitForPayment?: boolean } = {}) =>
    queryOptions({
      queryKey: portalKeys.quote(id, token),
      queryFn: ({ signal }) => api.get<PortalQuoteDto>(`/portal/quotes/${id}`, { query: withToken(token), signal }),
      retry: false,
      // Back from the checkout: the payment is recorded when the provider's webhook arrives, usually within seconds.
      refetchInterval: (query) => {
        const q = query.state.data;
        return options.waitForPayment && q && q.paidCents < q.depositCents && !q.paymentUnderReview ? 2000 : false;
      },
    }),
  jobs: (token?: string | null) =>
    queryOptions({
      queryKey: portalKeys.jobs(token),
      queryFn: ({ signal }) => api.get<{ items: PortalJobDto[] }>("/portal/jobs", { query: withToken(token), signal }),
    }),
  job: (id: number, token?: string | null) =>
    queryOptions({
      queryKey: portalKeys.job(id, token),
      queryFn: ({ signal }) => api.get<PortalJobDto>(`/portal/jobs/${id}`, { query: withToken(token), signal }),
    }),
  /** The job's agreed colour (its approved test panel), for a signed-in customer. */
  jobColour: (id: number) =>
    queryOptions({
      queryKey: portalKeys.jobColour(id),
      queryFn: ({ signal }) => api.get<JobColourDto>(`/jobs/${id}/colour`, { signal }),
    }),
  /** Test panels the shop sent for the customer to approve, and those already answered. */
  colourChoice: (id: number, token?: string | null) =>
    queryOptions({
      queryKey: portalKeys.colourChoice(id, token),
      queryFn: ({ signal }) => api.get<PortalColourDto>(`/portal/jobs/${id}/colour`, { query: withToken(token), signal }),
    }),
  /** What was sprayed on the job, in the customer's version (no notes, no costs). */
  finishRecord: (id: number) =>
    queryOptions({
      queryKey: portalKeys.finishRecord(id),
      queryFn: ({ signal }) => api.get<FinishRecordDto>(`/jobs/${id}/finish-record`, { signal }),
    }),
};

export const portalFinishRecordPdfUrl = (id: number) => apiUrl(`/jobs/${id}/finish-record.pdf`);

export const portalPdfUrl = (id: number, token?: string | null) => apiUrl(`/portal/quotes/${id}/pdf`, withToken(token));

function useAfterDecision(token?: string | null) {
  const queryClient = useQueryClient();
  return (quote: PortalQuoteDto) => {
    queryClient.setQueryData(portalKeys.quote(quote.id, token), quote);
    return Promise.all([
      queryClient.invalidateQueries({ queryKey: portalKeys.quotes(token) }),
      queryClient.invalidateQueries({ queryKey: portalKeys.jobs(token) }),
    ]);
  };
}

export function useApproveQuote(id: number, token?: string | null) {
  const after = useAfterDecision(token);
  return useMutation({
    mutationFn: (input: ApproveQuoteInput) => api.post<PortalQuoteDto>(`/portal/quotes/${id}/approve`, input, { query: withToken(token) }),
    onSuccess: after,
  });
}

export function useDeclineQuote(id: number, token?: string | null) {
  const after = useAfterDecision(token);
  return useMutation({
    mutationFn: (input: DeclineQuoteInput) => api.post<PortalQuoteDto>(`/portal/quotes/${id}/decline`, input, { query: withToken(token) }),
    onSuccess: after,
  });
}

/** The customer approves one of the panels sent: it becomes the job's agreed colour. */
export function useApprovePanel(jobId: number, token?: string | null) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ panelId, ...input }: ApproveQuoteInput & { panelId: number }) => api.post<PortalColourDto>(`/portal/panels/${panelId}/approve`, input, { query: withToken(token) }),
    onSuccess: (colour) => {
      queryClient.setQueryData(portalKeys.colourChoice(jobId, token), colour);
      return queryClient.invalidateQueries({ queryKey: portalKeys.jobColour(jobId) });
    },
  });
}

/** Starts the provider's hosted checkout for the deposit; the caller sends the browser to the returned URL. */
export function useStartCheckout(token?: string | null) {
  return useMutation({
    mutationFn: (quoteId: number) => api.post<CheckoutDto>("/payments/checkout", { quoteId }, { query: withToken(token) }),
  });
}
