import { queryOptions, useQuery } from "@tanstack/react-query";
import { UNIT_PRESETS, type ShopUnits } from "@shared/domain/measures";
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

/** The shop's chosen unit for each measure (the metric set until the settings arrive). */
export function useShopUnits(): ShopUnits {
  const s = useQuery(shopSettingsQueries.public()).data;
  const d = UNIT_PRESETS.metric;
  return {
    volume: s?.defaultVolumeUnit ?? d.volume,
    area: s?.defaultAreaUnit ?? d.area,
    film: s?.filmUnit ?? d.film,
    pressure: s?.pressureUnit ?? d.pressure,
    temperature: s?.tempUnit ?? d.temperature,
    mass: s?.massUnit ?? d.mass,
  };
}
