/**
 * Every table, one file per area under tables/. drizzle-kit reads this file to generate migrations;
 * area files import only from core.ts or an earlier area, never from here.
 */
export * from "./tables/core";
export * from "./tables/settings";
export * from "./tables/audit";
export * from "./tables/materials";
export * from "./tables/plans";
export * from "./tables/mix-sheets";
export * from "./tables/uploads";
export * from "./tables/quotes";
export * from "./tables/change-orders";
export * from "./tables/payments";
export * from "./tables/equipment";
export * from "./tables/booth";
export * from "./tables/schedule";
export * from "./tables/intake";
export * from "./tables/idempotency";
