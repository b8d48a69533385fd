import { describe, expect, it } from "vitest";
import { auditSubject, describeAuditChange, formatValue } from "../../src/features/audit/audit-words";

const labour = (rateCents: number, hours = 10) => ({ kind: "labour", description: "Prep and paint", hours, rateCents });
const materials = { kind: "materials", description: "Finish materials", costCents: 20000, markupPercent: 30 };

describe("the audit trail in words", () => {
  it("shows a quote line's rate change as money in words, never the stored key or JSON", () => {
    const rows = describeAuditChange({ lines: [labour(9500), materials], totalCents: 131036 }, { lines: [labour(10500), materials], totalCents: 141036 });
    expect(rows).toEqual([
      { label: "Line 1 (Prep and paint) · Rate", before: "$95.00", after: "$105.00" },
      { label: "Total", before: "$1,310.36", after: "$1,410.36" },
    ]);
    expect(rows.map((r) => `${r.label} ${r.before} ${r.after}`).join("\n")).not.toMatch(/rateCents|[{}"]|kind/);
  });

  it("writes a whole line in a sentence when one is added, with proper plurals", () => {
    const rows = describeAuditChange({ lines: [labour(9500, 1)] }, { lines: [labour(9500, 1), { kind: "sublet", description: "Chrome plating", amountCents: 20000 }] });
    expect(rows).toEqual([{ label: "Line 2 added", after: "Outside work: Chrome plating, $200.00" }]);
    expect(formatValue("lines", [labour(9500, 1)])).toBe("Labour: Prep and paint, 1 hour × $95.00/h");
    expect(formatValue("lines", [labour(9500, 2.5)])).toBe("Labour: Prep and paint, 2.5 hours × $95.00/h");
  });

  it("names settings in words: money in dollars, percents with %, taxed kinds by their labels", () => {
    expect(describeAuditChange({ labourRateCents: 9500, taxPercent: 7.25 }, { labourRateCents: 10500, taxPercent: 8 })).toEqual([
      { label: "Labour rate", before: "$95.00", after: "$105.00" },
      { label: "Sales tax", before: "7.25 %", after: "8 %" },
    ]);
    expect(formatValue("taxedKinds", ["materials", "sublet"])).toBe("materials, outside work");
  });

  it("compares plan layers one by one", () => {
    const before = { layers: ['Clear, 2 coats: clear S5-B02 2K urethane clear 4 parts'] };
    const after = { layers: ['Clear, 3 coats: clear S5-B02 2K urethane clear 4 parts'] };
    expect(describeAuditChange(before, after)).toEqual([{ label: "Layer 1", before: before.layers[0], after: after.layers[0] }]);
  });

  it("names a material by its stock number and name, not its row number", () => {
    const e = { entity: "material", entityId: "5", action: "cost_changed", before: { code: "S5-B02", name: "2K urethane clear", costCents: 9500 }, after: { code: "S5-B02", name: "2K urethane clear", costCents: 10500 } };
    expect(auditSubject(e)).toBe("Material S5-B02 2K urethane clear: cost changed");
    expect(describeAuditChange(e.before, e.after)).toEqual([{ label: "Cost", before: "$95.00", after: "$105.00" }]);
    expect(auditSubject({ entity: "quote", entityId: "12", action: "new_version", before: null, after: null })).toBe("Quote 12: new version");
  });
});
