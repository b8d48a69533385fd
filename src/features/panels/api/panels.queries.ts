import { keepPreviousData, queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type {
  CreatePanelInput,
  JobColourDto,
  PanelCompareDto,
  PanelDto,
  PanelLadderDto,
  PanelListDto,
  UpdatePanelInput,
} from "@shared/schemas/panel.schema";
import type { SendPanelsInput } from "@shared/schemas/colour-sign-off.schema";

export type PanelListParams = { ground?: string; candy?: string; coats?: number; q?: string; page?: number; pageSize?: number };
export type LadderParams = { ground: string; candy: string; toClear?: number; toToner?: number };

export const panelKeys = {
  all: ["panels"] as const,
  lists: () => [...panelKeys.all, "list"] as const,
  list: (p: PanelListParams) => [...panelKeys.lists(), p] as const,
  detail: (id: number) => [...panelKeys.all, "detail", id] as const,
  compare: (ids: number[]) => [...panelKeys.all, "compare", ids] as const,
  ladder: (p: LadderParams) => [...panelKeys.all, "ladder", p] as const,
  jobColour: (jobId: number) => [...panelKeys.all, "job", jobId] as const,
};

export const panelQueries = {
  list: (p: PanelListParams) =>
    queryOptions({ queryKey: panelKeys.list(p), queryFn: ({ signal }) => api.get<PanelListDto>("/panels", { query: p, signal }), placeholderData: keepPreviousData }),
  detail: (id: number) => queryOptions({ queryKey: panelKeys.detail(id), queryFn: ({ signal }) => api.get<PanelDto>(`/panels/${id}`, { signal }) }),
  compare: (ids: number[]) =>
    queryOptions({ queryKey: panelKeys.compare(ids), queryFn: ({ signal }) => api.get<PanelCompareDto>("/panels/compare", { query: { ids }, signal }) }),
  ladder: (p: LadderParams) =>
    queryOptions({ queryKey: panelKeys.ladder(p), queryFn: ({ signal }) => api.get<PanelLadderDto>("/panels/ladder", { query: p, signal }), placeholderData: keepPreviousData }),
  jobColour: (jobId: number) =>
    queryOptions({ queryKey: panelKeys.jobColour(jobId), queryFn: ({ signal }) => api.get<JobColourDto>(`/jobs/${jobId}/colour`, { signal }) }),
};

/** Every panel view (and the booth card's approved colour) may show a changed panel. */
function useAfterPanel() {
  const queryClient = useQueryClient();
  return () => Promise.all([queryClient.invalidateQueries({ queryKey: panelKeys.all }), queryClient.invalidateQueries({ queryKey: ["booth"] })]);
}

export function useCreatePanel() {
  const after = useAfterPanel();
  return useMutation({ mutationFn: (input: CreatePanelInput) => api.post<PanelDto>("/panels", input), onSuccess: after });
}

export function useUpdatePanel(id: number) {
  const after = useAfterPanel();
  return useMutation({ mutationFn: (input: UpdatePanelInput) => api.patch<PanelDto>(`/panels/${id}`, input), onSuccess: after });
}

export function useDeletePanel() {
  const after = useAfterPanel();
  return useMutation({ mutationFn: (id: number) => api.delete(`/panels/${id}`), onSuccess: after });
}

export function useSetApprovedPanel(jobId: number) {
  const after = useAfterPanel();
  return useMutation({ mutationFn: (panelId: number | null) => api.put<JobColourDto>(`/jobs/${jobId}/approved-panel`, { panelId }), onSuccess: after });
}

/** Sends test panels of a job to its customer to approve (the first in the path, the rest in the body). */
export function useSendPanels() {
  const after = useAfterPanel();
  return useMutation({
    mutationFn: ({ panelIds, ...input }: Omit<SendPanelsInput, "alsoPanelIds"> & { panelIds: number[] }) =>
      api.post<JobColourDto>(`/panels/${panelIds[0]}/send-to-customer`, { ...input, alsoPanelIds: panelIds.slice(1) }),
    onSuccess: after,
  });
}
