import { describe, expect, it } from "vitest";
import { planDocumentSchema, type PlanDto } from "@shared/schemas/plan.schema";
import { editorValuesOf, MIX_NAME_OF_CATEGORY, mixProblemOf, newLayer, toDocument, uniqueLabel } from "@/features/plans/components/plan-editor/editor-values";
import { MATERIAL_CATEGORIES } from "@shared/domain/materials";
import { planResolver } from "@/features/plans/components/plan-editor/editor-resolver";

const layer = (over: Partial<PlanDto["latest"]["layers"][number]> = {}) =>
  ({
    id: 1, position: 0, kind: "clear", name: "Clear", coats: 2, flashMinutes: 10, minutesPerCoat: 5, dryMinutes: 30,
    inductionMinutes: null, recoatMinMinutes: null, recoatMaxMinutes: null, gunTip: "1.3", pressurePsi: 26, overlapPct: 75,
    dryFilmPerCoat: 25, dryFilmUnit: "um", transferEfficiencyPct: 65, notes: null,
    components: [
      { materialId: 7, label: "clear", parts: 4, percent: null, percentOf: null },
      { materialId: 8, label: "reducer", parts: null, percent: 10, percentOf: ["clear"] },
    ],
    ...over,
  }) as unknown as PlanDto["latest"]["layers"][number];
const plan = (layers = [layer()]) => ({ name: "Two-stage", description: null, latest: { layers } }) as unknown as PlanDto;

describe("the plan editor's values", () => {
  it("a stored plan becomes text in the form and goes back to the same document the server checks", () => {
    const values = editorValuesOf(plan());
    expect(values.layers[0]).toMatchObject({ coats: "2", pressurePsi: "26", gunTip: "1.3", inductionMinutes: "", notes: "" });
    expect(values.layers[0]!.components.map((c) => [c.mode, c.parts, c.percent, c.percentOf])).toEqual([
      ["parts", "4", "", []],
      ["percent", "", "10", ["clear"]],
    ]);
    const doc = planDocumentSchema.parse(toDocument(values));
    expect(doc.layers[0]).toMatchObject({ coats: 2, flashMinutes: 10, pressurePsi: 26, inductionMinutes: null });
    // Parts or percent, never both.
    expect(doc.layers[0]!.components.map((c) => [c.materialId, c.parts, c.percent, c.percentOf])).toEqual([
      [7, 4, null, null],
      [8, null, 10, ["clear"]],
    ]);
  });

  it("a new layer starts with the usual figures and the kind's name", () => {
    expect(newLayer("sealer")).toMatchObject({ kind: "sealer", name: "Sealer", coats: "2", flashMinutes: "10", overlapPct: "75", components: [] });
  });

  it("names a component by its category until the planner does, numbering a second of the same kind", () => {
    for (const c of MATERIAL_CATEGORIES) expect(MIX_NAME_OF_CATEGORY[c]).toMatch(/^[a-z]+$/);
    expect(MIX_NAME_OF_CATEGORY.ground_coat).toBe("basecoat");
    expect(uniqueLabel("clear", ["sealer"])).toBe("clear");
    expect(uniqueLabel("clear", ["clear", "clear 2"])).toBe("clear 3");
  });

  it("the mix engine's complaint lands beside the field at fault, after the schema's own", async () => {
    const values = editorValuesOf(plan());
    values.layers[0]!.components[1]!.percentOf = ["nothing"];
    expect(mixProblemOf(values.layers[0]!.components)?.path).toMatch(/^components\.1\./);
    const out = await planResolver(values, undefined, { fields: {}, shouldUseNativeValidation: false });
    const errors = out.errors as { layers?: { components?: Record<string, { message?: string }>[] }[] };
    expect(Object.values(errors.layers?.[0]?.components?.[1] ?? {})[0]?.message).toBeTruthy();

    // A clean plan resolves to the checked document.
    const ok = await planResolver(editorValuesOf(plan()), undefined, { fields: {}, shouldUseNativeValidation: false });
    expect(ok.errors).toEqual({});
    expect((ok.values as { layers: unknown[] }).layers).toHaveLength(1);
  });
});
