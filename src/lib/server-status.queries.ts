import { queryOptions } from "@tanstack/react-query";
import { api } from "./api-client";

export type ServerStatus = { ok: boolean; time: string; demoMode: boolean };

/** The server's health check, read once: the app uses it to know whether this is a demo (with a mail outbox). */
export const serverStatusQueries = {
  health: () =>
    queryOptions({
      queryKey: ["server-status"] as const,
      queryFn: ({ signal }) => api.get<ServerStatus>("/health", { signal }),
      staleTime: Infinity,
    }),
};
