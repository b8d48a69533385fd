import type { z } from "zod";
import { staleEdit } from "../../db/edit-version";
import { and, eq, sql } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { shopSettings } from "../../db/schema";
import type { RequestContext } from "../../http/context";
import { recordAudit } from "../audit/audit.service";
import {
  DEFAULT_SETTINGS,
  shopSettingsSchema,
  type PublicShopSettings,
  type ShopSettings,
  updateShopSettingsSchema,
  type EditableShopSettings,
} from "../../../shared/schemas/settings.schema";

/** The shop's settings, with defaults for anything never set. */
export function getSettings(deps: { db: Pick<AppDeps["db"], "select"> }): ShopSettings {
  const row = deps.db.select().from(shopSettings).where(eq(shopSettings.id, 1)).get();
  const parsed = shopSettingsSchema.safeParse({ ...DEFAULT_SETTINGS, ...((row?.data as object) ?? {}) });
  return parsed.success ? parsed.data : DEFAULT_SETTINGS;
}

/** The settings as the owner edits them, with the edit version a save must send back. */
export function getEditableSettings(deps: { db: Pick<AppDeps["db"], "select"> }): EditableShopSettings {
  const row = deps.db.select({ version: shopSettings.version }).from(shopSettings).where(eq(shopSettings.id, 1)).get();
  return { ...getSettings(deps), version: row?.version ?? 1 };
}

export function getPublicSettings(deps: Pick<AppDeps, "db">): PublicShopSettings {
  const s = getSettings(deps);
  return {
    shopName: s.shopName,
    shopAddress: s.shopAddress,
    shopPhone: s.shopPhone,
    shopEmail: s.shopEmail,
    defaultVolumeUnit: s.defaultVolumeUnit,
    defaultAreaUnit: s.defaultAreaUnit,
    deltaEMatch: s.deltaEMatch,
    deltaEClose: s.deltaEClose,
    ratioTolerancePct: s.ratioTolerancePct,
    vocLimits: s.vocLimits,
  };
}

/** Money settings (labour rate, tax, deposit, markup) are audited as money; the rest as settings. */
const MONEY_KEYS = ["labourRateCents", "taxPercent", "taxAppliesTo", "depositPercent", "materialsMarkupPercent", "shopSuppliesPercent"];

export function updateSettings(deps: AppDeps, ctx: RequestContext, input: z.output<typeof updateShopSettingsSchema>): EditableShopSettings {
  const { version, ...patch } = input;
  const before = getSettings(deps);
  const after = shopSettingsSchema.parse({ ...before, ...patch });
  const now = deps.now();
  deps.db.transaction((tx) => {
    // The one row is created at version 1 when missing, then changed only if still at the version the owner read.
    tx.insert(shopSettings).values({ id: 1, data: before, updatedAt: now, updatedBy: null }).onConflictDoNothing().run();
    const saved = tx
      .update(shopSettings)
      .set({ data: after, updatedAt: now, updatedBy: ctx.actor.id, version: sql`${shopSettings.version} + 1` })
      .where(and(eq(shopSettings.id, 1), eq(shopSettings.version, version)))
      .run();
    if (saved.changes === 0) {
      const row = tx.select().from(shopSettings).where(eq(shopSettings.id, 1)).get()!;
      throw staleEdit(tx, "the settings", getEditableSettings({ db: tx }), row);
    }
    const changed = Object.keys(after).filter((k) => JSON.stringify(before[k as keyof ShopSettings]) !== JSON.stringify(after[k as keyof ShopSettings]));
    const pick = (o: ShopSettings, keys: string[]) => Object.fromEntries(keys.map((k) => [k, o[k as keyof ShopSettings]]));
    const money = changed.filter((k) => MONEY_KEYS.includes(k));
    const other = changed.filter((k) => !MONEY_KEYS.includes(k));
    if (money.length) recordAudit(tx, ctx, { kind: "money", entity: "settings", entityId: 1, action: "updated", before: pick(before, money), after: pick(after, money) }, now);
    if (other.length) recordAudit(tx, ctx, { kind: "settings", entity: "settings", entityId: 1, action: "updated", before: pick(before, other), after: pick(after, other) }, now);
  });
  return getEditableSettings(deps);
}
