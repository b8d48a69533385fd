import { queryOptions } from "@tanstack/react-query";
import type { PublicShopSettings } from "@shared/schemas/settings.schema";
import { api } from "./api-client";

/**
 * The shop's money-free settings (units, colour thresholds, ratio tolerance) that any staff screen may read.
 * Its key sits under ["settings"], so saving the settings refetches it.
 */
export const shopSettingsQueries = {
  public: () =>
    queryOptions({
      queryKey: ["settings", "shop"] as const,
      queryFn: ({ signal }) => api.get<PublicShopSettings>("/settings/shop", { signal }),
      staleTime: 5 * 60_000,
    }),
};
