import { describe, expect, it } from "vitest";
import { parse } from "csv-parse/sync";
import { CSV_DECIMALS } from "../../server/modules/compliance/compliance.router";
import { editAt, makeShop, type Shop } from "../support/test-app";
import { addMixedBatch } from "../support/batches";
import { lbPerGalToGPerL } from "../../shared/mix/index";

// NIST Handbook 44 App. C: 1 US gal = 3.785411784 L exactly; 1 lb = 453.59237 g exactly.
const GAL_ML = 3785.411784;
const LB_G = 453.59237;

async function shopWithLimits(extra: object = {}) {
  const s = await makeShop();
  await editAt(s, "owner", "/api/settings", { vocLimits: [{ layerKind: "clear", limitGPerL: 250 }, { layerKind: "ground_coat", limitGPerL: 420 }], ...extra });
  return s;
}

function enamelAndThinner(s: Shop, mixedAt: Date, layerKind: "clear" | "ground_coat" = "ground_coat") {
  // Metal Finishing Guidebook, App. B: 1 gal of enamel at 2.5 lb/gal VOC thinned with 0.25 gal of thinner
  // at 6.8 lb/gal gives 4.2 lb of VOC in 1.25 gal = 3.36 lb/gal.
  return addMixedBatch(s, s.jobA.id, {
    layerKind,
    mixedAt,
    lines: [
      { ml: GAL_ML, vocGPerL: lbPerGalToGPerL(2.5), category: "ground_coat" },
      { ml: GAL_ML / 4, vocGPerL: lbPerGalToGPerL(6.8), category: "reducer" },
    ],
  });
}

describe("compliance log", () => {
  it("computes a batch's VOC less water and exempt from its lines, in g/L and lb/gal, kg and lb", async () => {
    const s = await shopWithLimits();
    enamelAndThinner(s, new Date(2026, 9, 14, 10));
    const res = await s.as("owner").get("/api/compliance?from=2026-10-01&to=2026-10-31");
    expect(res.status).toBe(200);
    const b = res.body.batches[0];
    expect(b.voc.lbPerGal).toBeCloseTo(3.36, 10); // Metal Finishing Guidebook App. B
    expect(b.voc.gPerL).toBeCloseTo(3.36 * 119.826427, 3); // 1 lb/gal = 119.826427 g/L (NIST HB 44 definitions)
    expect(b.vocMass.lb).toBeCloseTo(4.2, 10);
    expect(b.vocMass.kg).toBeCloseTo((4.2 * LB_G) / 1000, 10);
    expect(b.volumeGal).toBeCloseTo(1.25, 12);
    expect(b.overLimit).toBe(false); // 402.6 g/L under the shop's 420 g/L ground-coat limit
  });

  it("leaves water out of the denominator (regulatory VOC less water)", async () => {
    const s = await shopWithLimits();
    // Metal Finishing Guidebook App. B: 3 parts A at 3.1 and 1 part B at 1.8 lb/gal (less water) with 7 parts water
    // → 11.1 / 4 = 2.775 lb/gal less water (the source prints 2.75, an arithmetic slip; references.md §3).
    addMixedBatch(s, s.jobA.id, {
      layerKind: "ground_coat",
      mixedAt: new Date(2026, 9, 2, 9),
      lines: [
        { ml: 3000, vocGPerL: lbPerGalToGPerL(3.1), category: "ground_coat" },
        { ml: 1000, vocGPerL: lbPerGalToGPerL(1.8), category: "additive" },
        { ml: 7000, vocGPerL: 0, waterExemptPct: 100, category: "reducer" },
      ],
    });
    const res = await s.as("estimator").get("/api/compliance?from=2026-10-01&to=2026-10-31");
    expect(res.body.batches[0].voc.lbPerGal).toBeCloseTo(2.775, 10);
  });

  it("flags a batch over its category's limit and a month over the shop's cap", async () => {
    const s = await shopWithLimits({ vocMonthlyCapKg: 3 });
    enamelAndThinner(s, new Date(2026, 10, 3, 9), "clear"); // 402.6 g/L in a clear: over the 250 g/L limit
    enamelAndThinner(s, new Date(2026, 10, 20, 9), "ground_coat");
    enamelAndThinner(s, new Date(2026, 9, 20, 9), "ground_coat");
    const res = await s.as("owner").get("/api/compliance?from=2026-10-01&to=2026-11-30");
    expect(res.body.batches.map((b: { overLimit: boolean }) => b.overLimit)).toEqual([false, true, false]);
    const [oct, nov] = res.body.months;
    // Each batch holds 4.2 lb = 1.905 kg of VOC; November's two batches (3.81 kg) pass the 3 kg cap.
    expect(oct).toMatchObject({ month: "2026-10", batches: 1, overCap: false, batchesOverLimit: 0 });
    expect(nov).toMatchObject({ month: "2026-11", batches: 2, overCap: true, batchesOverLimit: 1 });
    expect(nov.vocMass.lb).toBeCloseTo(8.4, 10);
    expect(res.body.totals.batchesOverLimit).toBe(1);
    const reducer = res.body.categories.find((c: { category: string }) => c.category === "reducer");
    expect(reducer.vocMass.lb).toBeCloseTo(3 * 0.25 * 6.8, 10);
  });

  it("builds in no limit: with none entered, nothing is flagged", async () => {
    const s = await makeShop();
    enamelAndThinner(s, new Date(2026, 10, 3, 9), "clear");
    const res = await s.as("owner").get("/api/compliance?from=2026-11-01&to=2026-11-30");
    expect(res.body.limits).toEqual([]);
    expect(res.body.batches[0]).toMatchObject({ limitGPerL: null, overLimit: false });
  });

  it("exports the batch log as CSV: each figure to the decimals it is measured to, units in the header", async () => {
    const s = await shopWithLimits();
    enamelAndThinner(s, new Date(2026, 10, 3, 9), "clear");
    addMixedBatch(s, s.jobB.id, { layerKind: "ground_coat", mixedAt: new Date(2026, 10, 4, 9), lines: [{ ml: 500, vocGPerL: 333.3, category: "ground_coat" }] });
    const json = (await s.as("owner").get("/api/compliance?from=2026-11-01&to=2026-11-30")).body;
    const csv = await s.as("owner").get("/api/compliance/export.csv?from=2026-11-01&to=2026-11-30");
    expect(csv.status).toBe(200);
    expect(csv.headers["content-type"]).toMatch(/text\/csv/);
    const rows: Record<string, string>[] = parse(csv.text, { columns: true });
    expect(rows).toHaveLength(2);
    expect(csv.text.split("\n")[0]).toBe("batch,mixed_at,job,job_title,layer,coating_category,volume_l,volume_gal,voc_g_per_l,voc_lb_per_gal,voc_kg,voc_lb,limit_g_per_l,over_limit");
    // No raw floating-point tails such as 0.47317647299999993.
    expect(csv.text).not.toMatch(/\d\.\d{6,}/);
    rows.forEach((row, i) => {
      const b = json.batches[i];
      expect(Number(row.batch)).toBe(b.id);
      // Volumes to the mL, VOC content to 0.1 g/L, VOC mass to the gram (CSV_DECIMALS); the same figures as the screen's, rounded.
      expect(row.voc_g_per_l).toBe(b.voc.gPerL.toFixed(1));
      expect(row.voc_kg).toBe(b.vocMass.kg.toFixed(3));
      expect(row.volume_l).toBe(b.volumeL.toFixed(3));
      expect(row.volume_gal).toBe(b.volumeGal.toFixed(4));
      expect(row.voc_lb).toBe(b.vocMass.lb.toFixed(3));
      expect(Math.abs(Number(row.voc_kg) - b.vocMass.kg)).toBeLessThanOrEqual(0.0005);
      for (const [column, digits] of Object.entries(CSV_DECIMALS)) {
        if (digits == null || row[column] === "") continue;
        expect(row[column], column).toMatch(new RegExp(`^\\d+\\.\\d{${digits}}$`));
      }
      expect(row.over_limit).toBe(b.overLimit ? "yes" : "no");
      expect(row.job_title).toBe(b.jobTitle);
    });
  });

  it("checks the date range, naming the field", async () => {
    const s = await makeShop();
    const res = await s.as("owner").get("/api/compliance?from=2026-12-01&to=2026-11-01");
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("to");
    expect((await s.as("owner").get("/api/compliance")).status).toBe(400);
  });
});
