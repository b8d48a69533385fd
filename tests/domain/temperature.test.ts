import { describe, expect, it } from "vitest";
import { cToF, fToC, switchTemperatureText } from "../../shared/domain/booth";

describe("switching the temperature unit converts the reading", () => {
  it("uses the NIST conversion (SP 811 §B.9: t/°F = 1.8 t/°C + 32)", () => {
    expect(cToF(100)).toBe(212); // boiling point of water at 1 atm, NIST
    expect(cToF(-40)).toBe(-40); // the two scales meet at −40
    expect(cToF(21)).toBeCloseTo(69.8, 10);
    expect(fToC(69.8)).toBeCloseTo(21, 10);
  });

  it("turns the typed 21 °C into 70 °F, and leaves empty or non-numeric text alone", () => {
    expect(switchTemperatureText("21", "C", "F")).toBe("70");
    expect(switchTemperatureText("70", "F", "C")).toBe("21");
    expect(switchTemperatureText("", "C", "F")).toBe("");
    expect(switchTemperatureText("warm", "C", "F")).toBe("warm");
    expect(switchTemperatureText("21", "C", "C")).toBe("21");
  });
});
