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
    // Invented sample limits and cap, set so the demo log shows a couple of batches over a limit and one month
    // over the cap; a real shop enters its own air permit's figures.
    vocLimits: [
      { layerKind: "adhesion_promoter", limitGPerL: 780 },
      { layerKind: "sealer", limitGPerL: 550 },
      { layerKind: "ground_coat", limitGPerL: 760 },
      { layerKind: "candy", limitGPerL: 630 },
      { layerKind: "effect_mid_coat", limitGPerL: 630 },
      { layerKind: "intercoat_clear", limitGPerL: 630 },
      { layerKind: "clear", limitGPerL: 465 },
    ],
    vocMonthlyCapKg: 8,
    // Common practice: about 15 % more than the film build needs (more for a candy, which is mixed once for every part).
    wasteAllowances: [
      { layerKind: "adhesion_promoter", pct: 15 },
      { layerKind: "sealer", pct: 15 },
      { layerKind: "ground_coat", pct: 15 },
      { layerKind: "candy", pct: 20 },
      { layerKind: "effect_mid_coat", pct: 15 },
      { layerKind: "intercoat_clear", pct: 15 },
      { layerKind: "clear", pct: 15 },
    ],
    minimumBatchMl: 100,
  };
  ctx.db.insert(shopSettings).values({ id: 1, data, updatedAt: ctx.now, updatedBy: ctx.userIds.owner }).run();
}
