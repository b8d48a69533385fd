import { describe, expect, it } from "vitest";
import {
  MixError,
  mixForTotal,
  mixFromComponent,
  resolveShares,
  weighingPlan,
  type MixComponent,
  type VolumeUnit,
} from "../../shared/mix/index";
import { catchMixError } from "./helpers";

const good: MixComponent[] = [
  { name: "clear", parts: 4 },
  { name: "hardener", parts: 1 },
  { name: "reducer", percent: 10, percentOf: "clear" },
];

describe("MixError", () => {
  it("is an Error with a name, a message, a component and a field", () => {
    const e = new MixError('Component "x": bad', { component: "x", field: "parts" });
    expect(e).toBeInstanceOf(Error);
    expect(e.name).toBe("MixError");
    expect(e.component).toBe("x");
    expect(e.field).toBe("parts");
  });
});

describe("invalid mixes throw a MixError naming the component", () => {
  it("zero, negative or non-finite parts", () => {
    for (const parts of [0, -1, Number.NaN, Number.POSITIVE_INFINITY]) {
      const e = catchMixError(() => resolveShares([good[0]!, { name: "hardener", parts }]));
      expect(e.component).toBe("hardener");
      expect(e.field).toBe("parts");
      expect(e.message).toMatch(/^Component "hardener": parts must be a finite number greater than 0/);
    }
  });

  it("zero, negative or non-finite percent", () => {
    for (const percent of [0, -10, Number.NaN]) {
      const e = catchMixError(() => resolveShares([good[0]!, { name: "reducer", percent, percentOf: "clear" }]));
      expect(e.component).toBe("reducer");
      expect(e.field).toBe("percent");
      expect(e.message).toContain('Component "reducer": percent');
    }
  });

  it("a non-positive density", () => {
    const e = catchMixError(() => resolveShares([{ name: "clear", parts: 1, densityGPerMl: 0 }]));
    expect(e.message).toMatch(/^Component "clear": densityGPerMl/);
  });

  it("percentOf naming an unknown component", () => {
    const e = catchMixError(() =>
      resolveShares([good[0]!, { name: "reducer", percent: 10, percentOf: "clearr" }]),
    );
    expect(e.message).toBe('Component "reducer": percentOf names unknown component "clearr"');
    expect(e.component).toBe("reducer");
    expect(e.field).toBe("percentOf");
  });

  it("percentOf empty, repeated or naming the component itself", () => {
    expect(catchMixError(() => resolveShares([good[0]!, { name: "r", percent: 5, percentOf: [] }])).component).toBe("r");
    expect(
      catchMixError(() => resolveShares([good[0]!, { name: "r", percent: 5, percentOf: ["clear", "clear"] }])).message,
    ).toContain('Component "r": percentOf names the same component twice');
    expect(catchMixError(() => resolveShares([good[0]!, { name: "r", percent: 5, percentOf: "r" }])).message).toBe(
      'Component "r": percentOf cannot name the component itself',
    );
  });

  it("a cycle in percentOf", () => {
    const e = catchMixError(() =>
      resolveShares([
        { name: "base", parts: 1 },
        { name: "a", percent: 10, percentOf: ["base", "b"] },
        { name: "b", percent: 10, percentOf: "c" },
        { name: "c", percent: 10, percentOf: "a" },
      ]),
    );
    expect(e.message).toBe('Component "a": percentOf forms a cycle ("a" → "b" → "c" → "a")');
    expect(e.component).toBe("a");
  });

  it("duplicate names", () => {
    const e = catchMixError(() => resolveShares([good[0]!, { name: "clear", parts: 1 }]));
    expect(e.message).toBe('Component "clear": the name is used twice');
  });

  it("no parts component", () => {
    const e = catchMixError(() =>
      resolveShares([
        { name: "a", percent: 10, percentOf: "b" },
        { name: "b", percent: 10, percentOf: "a" },
      ]),
    );
    expect(e.message).toBe("components: at least one component must be given in parts");
  });

  it("an empty list, a missing name, both or neither of parts and percent", () => {
    expect(catchMixError(() => resolveShares([])).field).toBe("components");
    expect(catchMixError(() => resolveShares([{ name: " ", parts: 1 }])).message).toBe("Component #1: needs a name");
    const both = { name: "x", parts: 1, percent: 5, percentOf: "clear" } as unknown as MixComponent;
    expect(catchMixError(() => resolveShares([good[0]!, both])).message).toBe(
      'Component "x": give either parts or percent, not both',
    );
    const neither = { name: "y" } as unknown as MixComponent;
    expect(catchMixError(() => resolveShares([good[0]!, neither])).component).toBe("y");
  });

  it("total ≤ 0 or not finite", () => {
    for (const total of [0, -5, Number.NaN, Number.POSITIVE_INFINITY]) {
      const e = catchMixError(() => mixForTotal(good, total, "mL"));
      expect(e.field).toBe("total");
      expect(e.message).toMatch(/^total: must be a finite number greater than 0/);
    }
  });

  it("an unknown unit", () => {
    const e = catchMixError(() => mixForTotal(good, 1, "litre" as VolumeUnit));
    expect(e.field).toBe("unit");
    expect(e.message).toContain('unknown volume unit "litre"');
    expect(catchMixError(() => mixFromComponent(good, "clear", 1, "g" as VolumeUnit)).field).toBe("unit");
  });

  it("a known component that is not in the mix, or a bad amount of it", () => {
    const e = catchMixError(() => mixFromComponent(good, "toner", 100, "mL"));
    expect(e.message).toBe('Component "toner": not in this mix');
    const a = catchMixError(() => mixFromComponent(good, "clear", 0, "mL"));
    expect(a.message).toMatch(/^Component "clear": amount must be/);
  });

  it("weighing a line without a density", () => {
    const lines = mixForTotal(good, 100, "mL");
    expect(catchMixError(() => weighingPlan(lines)).message).toBe(
      'Component "clear": has no density, so it cannot be weighed',
    );
  });
});

describe("keys left undefined count as absent", () => {
  it("a parts component with percent/percentOf set to undefined is still a parts component", () => {
    const fromForm = [
      { name: "clear", parts: 4, percent: undefined, percentOf: undefined },
      { name: "reducer", parts: undefined, percent: 25, percentOf: "clear" },
    ] as unknown as MixComponent[];
    const shares = resolveShares(fromForm);
    expect(shares.map((s) => s.share)).toEqual([0.8, 0.2]);
  });
});
