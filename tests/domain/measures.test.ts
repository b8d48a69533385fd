import { describe, expect, it } from "vitest";
import { BAR_PER_PSI, convertFilm, convertPressure, UNIT_PRESETS } from "../../shared/domain/measures";

describe("the shop's units of measure", () => {
  it("converts pressure with NIST's psi (SP 811 App. B.8: 1 psi = 6.894 757 kPa)", () => {
    expect(BAR_PER_PSI).toBeCloseTo(0.06894757, 8);
    expect(convertPressure(29, "psi", "bar")).toBeCloseTo(1.99948, 4);
    expect(convertPressure(2, "bar", "psi")).toBeCloseTo(29.0075, 4);
    expect(convertPressure(26, "psi", "psi")).toBe(26);
  });

  it("converts film with the exact mil (0.001 in = 25.4 µm)", () => {
    expect(convertFilm(2, "mil", "um")).toBeCloseTo(50.8, 12);
    expect(convertFilm(50.8, "um", "mil")).toBeCloseTo(2, 12);
  });

  it("each system names one unit per measure, with no metric unit in the US set and none of the US units in the metric one", () => {
    expect(UNIT_PRESETS.metric).toEqual({ volume: "mL", area: "m2", film: "um", pressure: "bar", temperature: "C", mass: "g" });
    expect(Object.values(UNIT_PRESETS.us).some((u) => (Object.values(UNIT_PRESETS.metric) as string[]).includes(u))).toBe(false);
  });
});
