import { describe, expect, it } from "vitest";
import { makeShop, editAt } from "../support/test-app";
import { auditLog } from "../../server/db/schema";

describe("shop settings", () => {
  it("the owner changes the labour rate and tax; the change is audited as money with before and after", async () => {
    const s = await makeShop();
    const res = await editAt(s, "owner", "/api/settings", { labourRateCents: 9000, taxPercent: 6, shopName: "Test Shop" });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ labourRateCents: 9000, taxPercent: 6, shopName: "Test Shop" });
    expect((await s.as("estimator").get("/api/settings")).body.labourRateCents).toBe(9000);
    const audit = s.db.select().from(auditLog).all();
    const money = audit.find((a) => a.kind === "money")!;
    expect(money).toMatchObject({ entity: "settings", action: "updated", userId: s.owner.id });
    expect(money.before).toEqual({ labourRateCents: 8500, taxPercent: 0 });
    expect(money.after).toEqual({ labourRateCents: 9000, taxPercent: 6 });
    expect(audit.find((a) => a.kind === "settings")!.after).toEqual({ shopName: "Test Shop" });
  });

  it("rejects a negative rate and fractional cents, naming the fields, and keeps the old values", async () => {
    const s = await makeShop();
    const res = await editAt(s, "owner", "/api/settings", { labourRateCents: 12.5, taxPercent: -1 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["labourRateCents", "taxPercent"]);
    expect((await s.as("owner").get("/api/settings")).body.labourRateCents).toBe(8500);
  });

  it("painters and customers read only the money-free part", async () => {
    const s = await makeShop();
    const res = await s.as("painter").get("/api/settings/shop");
    expect(res.status).toBe(200);
    expect(Object.keys(res.body).some((k) => /rate|tax|deposit|markup|cents/i.test(k))).toBe(false);
  });

  it("the shop picks a unit system with a unit per measure, which every staff screen reads, and a bad unit is refused by name", async () => {
    const s = await makeShop();
    let shop = await s.as("painter").get("/api/settings/shop");
    expect(shop.body).toMatchObject({ unitSystem: "metric", defaultVolumeUnit: "mL", filmUnit: "um", pressureUnit: "bar", tempUnit: "C", massUnit: "g" });
    const saved = await editAt(s, "owner", "/api/settings", { unitSystem: "us", defaultVolumeUnit: "floz", defaultAreaUnit: "ft2", filmUnit: "mil", pressureUnit: "psi", tempUnit: "F", massUnit: "oz" });
    expect(saved.status).toBe(200);
    shop = await s.as("painter").get("/api/settings/shop");
    expect(shop.body).toMatchObject({ unitSystem: "us", filmUnit: "mil", pressureUnit: "psi", tempUnit: "F", massUnit: "oz" });
    // An override: a US shop that reads its gun gauges in bar.
    expect((await editAt(s, "owner", "/api/settings", { pressureUnit: "bar" })).status).toBe(200);
    expect((await s.as("painter").get("/api/settings/shop")).body).toMatchObject({ unitSystem: "us", pressureUnit: "bar" });
    const bad = await editAt(s, "owner", "/api/settings", { pressureUnit: "kgf" });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain("pressureUnit");
  });
});

describe("audit trail for users", () => {
  it("records a role change with who, before and after", async () => {
    const s = await makeShop();
    await editAt(s, "owner", `/api/users/${s.painter.id}`, { role: "estimator" });
    const entry = s.db.select().from(auditLog).all().find((a) => a.entityId === s.painter.id)!;
    expect(entry).toMatchObject({ kind: "user", action: "role_changed", userId: s.owner.id, before: { role: "painter" }, after: { role: "estimator" } });
    expect(entry.address).toBeTruthy();
  });
});
