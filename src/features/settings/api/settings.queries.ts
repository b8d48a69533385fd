import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "@/lib/api-client";
import type { EditableShopSettings, UpdateShopSettings } from "@shared/schemas/settings.schema";

export const settingsKeys = {
  /** Also the prefix of ["settings", "shop"] (the money-free settings other screens read). */
  all: ["settings"] as const,
  full: () => [...settingsKeys.all, "full"] as const,
};

export const settingsQueries = {
  /** Everything, rates included (office roles). */
  full: () =>
    queryOptions({
      queryKey: settingsKeys.full(),
      queryFn: ({ signal }) => api.get<EditableShopSettings>("/settings", { signal }),
    }),
};

/** Owner only. Afterwards every settings read is refetched (the VOC log refetches on its own when next opened). */
export function useUpdateSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateShopSettings) => api.patch<EditableShopSettings>("/settings", input),
    onSuccess: (saved) => {
      queryClient.setQueryData(settingsKeys.full(), saved);
      return queryClient.invalidateQueries({ queryKey: settingsKeys.all });
    },
  });
}
