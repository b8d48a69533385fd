import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type {
  CopyAsTemplateInput,
  JobPlanDto,
  PlanDocumentInput,
  PlanDto,
  PlanSummaryDto,
  PlanVersionDto,
  PlanVersionSummaryDto,
  StartJobPlanInput,
} from "@shared/schemas/plan.schema";

export const planKeys = {
  all: ["plans"] as const,
  lists: () => [...planKeys.all, "list"] as const,
  list: (kind: "template" | "job") => [...planKeys.lists(), kind] as const,
  detail: (id: number) => [...planKeys.all, "detail", id] as const,
  versions: (id: number) => [...planKeys.all, "versions", id] as const,
  version: (id: number, versionId: number) => [...planKeys.all, "version", id, versionId] as const,
  jobPlans: () => [...planKeys.all, "job"] as const,
  jobPlan: (jobId: number) => [...planKeys.jobPlans(), jobId] as const,
};

export const planQueries = {
  list: (kind: "template" | "job" = "template") =>
    queryOptions({ queryKey: planKeys.list(kind), queryFn: ({ signal }) => api.get<PlanSummaryDto[]>("/plans", { query: { kind }, signal }) }),
  detail: (id: number) => queryOptions({ queryKey: planKeys.detail(id), queryFn: ({ signal }) => api.get<PlanDto>(`/plans/${id}`, { signal }) }),
  versions: (id: number) =>
    queryOptions({ queryKey: planKeys.versions(id), queryFn: ({ signal }) => api.get<PlanVersionSummaryDto[]>(`/plans/${id}/versions`, { signal }) }),
  version: (id: number, versionId: number) =>
    queryOptions({
      queryKey: planKeys.version(id, versionId),
      queryFn: ({ signal }) => api.get<PlanVersionDto>(`/plans/${id}/versions/${versionId}`, { signal }),
      // A stored version never changes once it is locked.
      staleTime: 5 * 60_000,
    }),
  /** The job's current plan with its estimate. */
  jobPlan: (jobId: number) => queryOptions({ queryKey: planKeys.jobPlan(jobId), queryFn: ({ signal }) => api.get<JobPlanDto>(`/jobs/${jobId}/plan`, { signal }) }),
};

/** After a plan changes, everything about plans is refetched (lists, versions, job plans and estimates). */
function useAfterPlanWrite() {
  const queryClient = useQueryClient();
  return (plan?: PlanDto) => {
    if (plan) queryClient.setQueryData(planKeys.detail(plan.id), plan);
    return queryClient.invalidateQueries({ queryKey: planKeys.all, predicate: (q) => !plan || q.queryKey[2] !== plan.id || q.queryKey[1] !== "detail" });
  };
}

export function useCreateTemplate() {
  const after = useAfterPlanWrite();
  return useMutation({ mutationFn: (doc: PlanDocumentInput) => api.post<PlanDto>("/plans", doc), onSuccess: (p) => after(p) });
}

export function useSavePlan(id: number) {
  const after = useAfterPlanWrite();
  return useMutation({ mutationFn: (doc: PlanDocumentInput & { version: number }) => api.put<PlanDto>(`/plans/${id}`, doc), onSuccess: (p) => after(p) });
}

export function useDeletePlan() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete(`/plans/${id}`),
    onSuccess: (_d, id) => {
      queryClient.removeQueries({ queryKey: planKeys.detail(id) });
      return queryClient.invalidateQueries({ queryKey: planKeys.all });
    },
  });
}

export function useStartJobPlan(jobId: number) {
  const after = useAfterPlanWrite();
  return useMutation({ mutationFn: (input: StartJobPlanInput) => api.post<PlanDto>(`/jobs/${jobId}/plan`, input), onSuccess: (p) => after(p) });
}

export function useCopyAsTemplate(id: number) {
  const after = useAfterPlanWrite();
  return useMutation({ mutationFn: (input: CopyAsTemplateInput) => api.post<PlanDto>(`/plans/${id}/copy-as-template`, input), onSuccess: (p) => after(p) });
}
