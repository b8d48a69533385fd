import { shopSettings } from "../schema";
import { DEFAULT_SETTINGS, type ShopSettings } from "../../../shared/schemas/settings.schema";
import { DEMO_SHOP, type SeedContext } from "./core";

/** The demo shop's settings. The VOC limits are invented sample values the owner is meant to replace. */
export function seedSettings(ctx: SeedContext) {
  const data: ShopSettings = {
    ...DEFAULT_SETTINGS,
    shopName: DEMO_SHOP.name,
    shopAddress: "7 Tannery Lane, Harrow Creek",
    shopPhone: "555-0100",
    shopEmail: "hello@harrowcreek.example.test",
    labourRateCents: 9500,
    taxPercent: 7.25,
    taxAppliesTo: ["materials", "supplies"],
    depositPercent: 40,
    materialsMarkupPercent: 30,
    shopSuppliesPercent: 8,
    quoteValidDays: 30,
    quoteTerms: "Deposit orders the materials and books the booth. Balance due on collection. Colour is agreed on a sprayed test panel before work starts.",
    defaultVolumeUnit: "mL",
    defaultAreaUnit: "m2",
    vocLimits: [
      { layerKind: "adhesion_promoter", limitGPerL: 540 },
      { layerKind: "sealer", limitGPerL: 250 },
      { layerKind: "ground_coat", limitGPerL: 420 },
      { layerKind: "candy", limitGPerL: 420 },
      { layerKind: "effect_mid_coat", limitGPerL: 420 },
      { layerKind: "intercoat_clear", limitGPerL: 420 },
      { layerKind: "clear", limitGPerL: 250 },
    ],
    vocMonthlyCapKg: 40,
  };
  ctx.db.insert(shopSettings).values({ id: 1, data, updatedAt: ctx.now, updatedBy: ctx.userIds.owner }).run();
}
