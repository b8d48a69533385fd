import { describe, expect, it } from "vitest";
import { makeShop } from "../support/test-app";
import { computeMix } from "../../shared/mix/index";

describe("POST /api/mix/compute", () => {
  it("returns the same result as the shared engine the browser runs", async () => {
    const s = await makeShop();
    const request = {
      components: [
        { name: "clear", parts: 4, densityGPerMl: 1.0 },
        { name: "hardener", parts: 1, densityGPerMl: 1.1 },
        { name: "reducer", parts: 1, densityGPerMl: 0.87 },
      ],
      mode: "total" as const,
      amount: 300,
      unit: "mL" as const,
      rounding: { step: 0.1, unit: "g" as const },
    };
    const res = await s.as("painter").post("/api/mix/compute").send(request);
    expect(res.status).toBe(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(computeMix(request))));
    // 4:1:1 of 300 mL with densities 1.00 / 1.10 / 0.87 g/mL weighs 200.00 → 255.00 → 298.50 g cumulative
    // (worked example, references.md §7, computed from the definition mass = volume × density).
    expect(res.body.scale.steps.map((t: { scaleReads: number }) => t.scaleReads)).toEqual([200, 255, 298.5]);
    expect(res.body.scale.total).toBe(298.5);
  });

  it("mixes from the amount of one component on hand", async () => {
    const s = await makeShop();
    const res = await s
      .as("owner")
      .post("/api/mix/compute")
      .send({ components: [{ name: "base", parts: 1 }, { name: "reducer", percent: 10, percentOf: "base" }], mode: "component", knownName: "base", amount: 100, unit: "mL" });
    // Reducing 100 mL of base by 10 % adds 10 mL of reducer (common practice: percent of the base).
    expect(res.body.lines.map((l: { volume: number }) => l.volume)).toEqual([100, 10]);
  });

  it("turns a mix the engine cannot resolve into a 400 naming the component", async () => {
    const s = await makeShop();
    const res = await s
      .as("owner")
      .post("/api/mix/compute")
      .send({ components: [{ name: "clear", parts: 4 }, { name: "reducer", percent: 5, percentOf: "clearr" }], mode: "total", amount: 500, unit: "mL" });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/reducer.*clearr/);
    expect(res.body.error.fields).toBeDefined();
  });

  it("rejects a zero amount and an unknown unit, naming the fields", async () => {
    const s = await makeShop();
    const res = await s.as("owner").post("/api/mix/compute").send({ components: [{ name: "clear", parts: 4 }], mode: "total", amount: 0, unit: "bucket" });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["amount", "unit"]);
  });
});
