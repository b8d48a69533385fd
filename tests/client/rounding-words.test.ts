import { describe, expect, it } from "vitest";
import { roundingHeadline, smallPercent } from "../../src/components/ui/rounding-words";

describe("the rounding note's headline", () => {
  it("never says a ratio stays \"within 0 %\"", () => {
    // The old note printed the tolerance with one decimal, so a 0.04 % tolerance read "within 0 %".
    for (const tolerancePct of [0, 0.04, 0.5, 2]) {
      for (const worstPct of [0, 0.01, 0.03]) {
        const text = roundingHeadline({ stepText: "25 mL", worstPct, tolerancePct, movedCount: worstPct > tolerancePct ? 1 : 0 });
        expect(text).not.toMatch(/within 0 %|beyond 0 %|\b0 %/);
      }
    }
  });

  it("says exact when nothing moved, the largest move against the shop's tolerance otherwise", () => {
    expect(roundingHeadline({ stepText: "25 mL", worstPct: 0, tolerancePct: 2, movedCount: 0 })).toBe("Rounded to 25 mL: every ratio is exact.");
    expect(roundingHeadline({ stepText: "1 g", worstPct: 0.42, tolerancePct: 2, movedCount: 0 })).toBe("Rounded to 1 g: the largest ratio move is 0.4 % (the shop allows 2 %).");
    expect(roundingHeadline({ stepText: "1 g", worstPct: 0.02, tolerancePct: 0.5, movedCount: 0 })).toBe(
      "Rounded to 1 g: the largest ratio move is less than 0.1 % (the shop allows 0.5 %).",
    );
    expect(roundingHeadline({ stepText: "10 mL", worstPct: 4.5, tolerancePct: 2, movedCount: 2 })).toBe("Rounding to 10 mL moves 2 ratios beyond the shop's 2 % tolerance:");
    expect(roundingHeadline({ stepText: "10 mL", worstPct: 0.3, tolerancePct: 0, movedCount: 1 })).toBe("Rounding to 10 mL moves one ratio away from exact:");
  });

  it("shows small percentages without rounding them to zero", () => {
    expect(smallPercent(0)).toBe("0");
    expect(smallPercent(0.04)).toBe("less than 0.1");
    expect(smallPercent(0.05)).toBe("0.1");
    expect(smallPercent(2)).toBe("2");
  });
});
