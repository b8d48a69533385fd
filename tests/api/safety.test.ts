import { describe, expect, it } from "vitest";
import { cautionsFor } from "../../shared/domain/safety";

describe("safety cautions", () => {
  it("asks for isocyanate-rated respiratory protection when a hardener is present, and always defers to the SDS", () => {
    // NIOSH Alert 96-111 and EPA DfE 744-F-00-007: isocyanate paints call for supplied-air respirators.
    const c = cautionsFor([{ containsIsocyanates: true }, { flammable: true }]);
    expect(c.map((x) => x.id)).toEqual(["isocyanates", "flammable", "defer"]);
    expect(c[0]!.text).toMatch(/supplied-air/);
    expect(c[2]!.text).toMatch(/safety data sheet/);
  });

  it("shows nothing for a layer with no hazardous material", () => {
    expect(cautionsFor([{ containsIsocyanates: false, flammable: false }])).toEqual([]);
  });
});
