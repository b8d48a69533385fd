import { queryOptions } from "@tanstack/react-query";
import { api, apiUrl } from "@/lib/api-client";

export type OutboxAttachment = { filename: string; contentType: string; size: number };
export type OutboxMessage = {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  attachments: OutboxAttachment[];
};

export const outboxKeys = {
  all: ["outbox"] as const,
  list: () => [...outboxKeys.all, "list"] as const,
};

export const outboxQueries = {
  list: () =>
    queryOptions({
      queryKey: outboxKeys.list(),
      queryFn: ({ signal }) => api.get<{ items: OutboxMessage[] }>("/outbox", { signal }),
      refetchInterval: 15_000,
    }),
};

export const outboxAttachmentUrl = (messageId: string, index: number) =>
  apiUrl(`/outbox/${encodeURIComponent(messageId)}/attachments/${index}`);
