import { describe, expect, it } from "vitest";
import { idFrom } from "@/hooks/use-id-param";

describe("a record id from the path", () => {
  it("takes whole numbers above 0 and nothing else", () => {
    expect(idFrom("42")).toEqual({ id: 42, valid: true });
    for (const bad of [undefined, "", "0", "-3", "1.5", "12abc", "new", "1e400"]) expect(idFrom(bad).valid, String(bad)).toBe(false);
  });
});
