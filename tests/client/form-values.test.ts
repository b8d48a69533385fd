import { describe, expect, it } from "vitest";
import { emptyToNull } from "@/lib/form-values";

describe("form values", () => {
  it("an empty box or an unpicked select is none (null); anything typed is kept as typed, 0 included", () => {
    expect(emptyToNull("")).toBeNull();
    expect(emptyToNull(undefined)).toBeNull();
    expect(emptyToNull("0")).toBe("0");
    expect(emptyToNull(0)).toBe(0);
    expect(emptyToNull(" 12 ")).toBe(" 12 ");
  });
});
