import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { mixForTotal, weighingPlan, type MixComponent } from "../../shared/mix/index";
import { mixArb } from "./helpers";

describe("weighing a mix one component at a time", () => {
  it("the scale readings are sums of the targets shown, so the last one is the stated total", () => {
    // 4:1:1 of 350 mL at 1.02 / 1.07 / 0.871 g/mL (invented data-sheet densities):
    // exact grams 238.0, 62.4167, 50.8083 → 351.225 g. Each target is a whole 0.1 g step.
    const mix: MixComponent[] = [
      { name: "clear", parts: 4, densityGPerMl: 1.02 },
      { name: "hardener", parts: 1, densityGPerMl: 1.07 },
      { name: "reducer", parts: 1, densityGPerMl: 0.871 },
    ];
    const plan = weighingPlan(mixForTotal(mix, 350, "mL"), { components: mix });
    const targets = plan.steps.map((s) => s.target);
    expect(plan.steps.map((s) => s.scaleReads)).toEqual([targets[0], Number((targets[0]! + targets[1]!).toFixed(1)), plan.total]);
    expect(plan.total).toBe(Number(targets.reduce((a, b) => a + b, 0).toFixed(1)));
    // Never less than asked (351.225 g), never more than one step per component over.
    expect(plan.total).toBeGreaterThanOrEqual(351.225);
    expect(plan.total).toBeLessThanOrEqual(351.225 + 0.3 + 1e-9);
  });

  it("weighs in the sheet's mass unit and step: ounces on a 0.05 oz scale", () => {
    // 1 oz = 28.349523125 g exactly (NIST Handbook 44 App. C).
    const mix: MixComponent[] = [
      { name: "clear", parts: 2, densityGPerMl: 1 },
      { name: "hardener", parts: 1, densityGPerMl: 1 },
    ];
    const plan = weighingPlan(mixForTotal(mix, 300, "mL"), { unit: "oz", step: 0.05, components: mix });
    expect(plan.unit).toBe("oz");
    expect(plan.steps[0]!.exact).toBeCloseTo(200 / 28.349523125, 12);
    for (const s of plan.steps) expect(Math.abs(s.target / 0.05 - Math.round(s.target / 0.05))).toBeLessThan(1e-9);
    expect(plan.steps.at(-1)!.scaleReads).toBe(plan.total);
  });

  it("property: readings climb by exactly each target and end at the total, for any mix", () => {
    fc.assert(
      fc.property(mixArb, fc.double({ min: 20, max: 4000, noNaN: true }), fc.constantFrom(0.1, 0.5, 1, 5), (mix, total, step) => {
        const withDensity = mix.map((c) => ({ ...c, densityGPerMl: c.densityGPerMl ?? 1 }));
        const plan = weighingPlan(mixForTotal(withDensity, total, "mL"), { step, components: withDensity });
        let units = 0;
        for (const s of plan.steps) {
          units += Math.round(s.target / step);
          expect(Math.abs(s.scaleReads - units * step)).toBeLessThan(1e-6);
        }
        expect(Math.abs(plan.total - units * step)).toBeLessThan(1e-6);
        expect(plan.total).toBeGreaterThanOrEqual(plan.rounded.exactTotal * (1 - 1e-9));
      }),
    );
  });
});
