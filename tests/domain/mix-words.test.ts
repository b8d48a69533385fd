import { describe, expect, it } from "vitest";
import { mixComponentWords, mixSentence, type WordedComponent } from "../../shared/domain/mix-words";

const candy: WordedComponent[] = [
  { label: "clear", materialCode: "S5-B01", materialName: "Intercoat clear", parts: 1, percent: null, percentOf: null },
  { label: "reducer", materialCode: "S6-B02", materialName: "Reducer", parts: 1, percent: null, percentOf: null },
  { label: "toner", materialCode: "S4-B04", materialName: "Candy toner", parts: null, percent: 10, percentOf: ["clear"] },
];

describe("mix words say what every percentage is of", () => {
  it("names each component by material and states the percent's base as the plan gives it", () => {
    const w = mixComponentWords(candy);
    expect(w.map((x) => x.material)).toEqual(["S5-B01 Intercoat clear", "S6-B02 Reducer", "S4-B04 Candy toner"]);
    expect(w[2]!.amount).toBe("10 % of S5-B01 Intercoat clear");
    expect(w[0]!.amount).toBe("1 part");
  });

  it("gives each component's share of the ready-to-spray mix", () => {
    // Toner 10 % of the clear: 1 : 1 : 0.1 by volume → toner 0.1 / 2.1 = 4.7619 % of the ready-to-spray mix, while it
    // is 0.1 / 1.1 = 9.09 % of clear + toner alone (worked by hand from the parts-by-volume convention).
    const w = mixComponentWords(candy);
    expect(w[2]!.readyPct).toBeCloseTo((0.1 / 2.1) * 100, 10);
    expect(w[0]!.readyPct).toBeCloseTo((1 / 2.1) * 100, 10);
    expect(mixSentence(candy)).toBe(
      "S5-B01 Intercoat clear 1 part, S6-B02 Reducer 1 part, S4-B04 Candy toner 10 % of S5-B01 Intercoat clear (ready to spray: 47.62 % / 47.62 % / 4.76 %)",
    );
  });

  it("tells two clears apart by their material and leaves out shares a broken mix cannot give", () => {
    const broken: WordedComponent[] = [{ label: "toner", materialCode: "S4-B04", materialName: "Candy toner", parts: null, percent: 10, percentOf: ["nothing"] }];
    expect(mixComponentWords(broken)[0]!.readyPct).toBeNull();
    expect(mixSentence(broken)).toBe("S4-B04 Candy toner 10 % of nothing");
  });
});

describe("durations read the way a data sheet means them", () => {
  it("shows 720 min as 12 h, 90 as 1 h 30 min, and short times in minutes", async () => {
    const { formatMinutes } = await import("../../shared/domain/duration");
    expect(formatMinutes(720)).toBe("12 h");
    expect(formatMinutes(90)).toBe("1 h 30 min");
    expect(formatMinutes(45)).toBe("45 min");
    expect(formatMinutes(0)).toBe("0 min");
    expect(formatMinutes(0.5)).toBe("0.5 min");
    expect(formatMinutes(119.8)).toBe("2 h");
  });
});
