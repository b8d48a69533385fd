import { keepPreviousData, queryOptions } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { Page } from "@shared/api/pagination";
import type { AuditEntryDto, AuditKindName } from "@shared/schemas/audit.schema";

export type AuditListParams = {
  page: number;
  pageSize: number;
  q?: string;
  kind?: AuditKindName;
  userId?: string;
  from?: string;
  to?: string;
};

export const auditKeys = {
  all: ["audit"] as const,
  list: (params: AuditListParams) => [...auditKeys.all, "list", params] as const,
};

export const auditQueries = {
  /** Newest first; the trail is read-only, so there are no mutations here. */
  list: (params: AuditListParams) =>
    queryOptions({
      queryKey: auditKeys.list(params),
      queryFn: ({ signal }) => api.get<Page<AuditEntryDto>>("/audit", { query: params, signal }),
      placeholderData: keepPreviousData,
    }),
};
