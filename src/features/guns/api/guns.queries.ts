import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { GunDto, GunInput } from "@shared/schemas/spray-setup.schema";

export const gunKeys = {
  all: ["guns"] as const,
  list: () => [...gunKeys.all, "list"] as const,
};

export const gunQueries = {
  list: () => queryOptions({ queryKey: gunKeys.list(), queryFn: ({ signal }) => api.get<GunDto[]>("/guns", { signal }), staleTime: 60_000 }),
};

/** The gun list changed: the list, and the booth cards that offer it, refetch. */
function useAfterGun() {
  const queryClient = useQueryClient();
  return () => Promise.all([queryClient.invalidateQueries({ queryKey: gunKeys.all }), queryClient.invalidateQueries({ queryKey: ["booth"] })]);
}

export function useCreateGun() {
  const after = useAfterGun();
  return useMutation({ mutationFn: (input: GunInput) => api.post<GunDto>("/guns", input), onSuccess: after });
}

export function useUpdateGun() {
  const after = useAfterGun();
  return useMutation({ mutationFn: ({ id, ...input }: Partial<GunInput> & { id: number; version: number }) => api.patch<GunDto>(`/guns/${id}`, input), onSuccess: after });
}
