import { describe, expect, it } from "vitest";
import { CLOSED_STAGES, DUE_STAGES, isClosedStage, OPEN_STAGES, STAGES } from "@shared/domain/stages";

describe("which stages are open, closed and due", () => {
  it("splits every stage into open or closed, once", () => {
    expect([...OPEN_STAGES, ...CLOSED_STAGES].sort()).toEqual([...STAGES].sort());
    expect(OPEN_STAGES.filter(isClosedStage)).toEqual([]);
    expect(CLOSED_STAGES).toEqual(["delivered", "cancelled"]);
  });

  it("counts a due date only while work is left: a ready job waits for its customer, not for the shop", () => {
    expect(DUE_STAGES).toEqual(["inquiry", "quoted", "booked", "in_prep", "in_booth", "curing", "finishing"]);
    expect(DUE_STAGES.every((s) => OPEN_STAGES.includes(s))).toBe(true);
  });
});
