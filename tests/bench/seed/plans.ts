import type Database from "better-sqlite3";
import type { Rand } from "./random";

/** A layer of a job's plan as the bulk seed needs it (ids are the copied rows'). */
export type SeedLayer = {
  id: number;
  kind: string;
  coats: number;
  minutesPerCoat: number;
  flashMinutes: number;
  dryMinutes: number;
  components: { materialId: number; label: string; parts: number | null; percent: number | null }[];
};
export type SeedPlan = { planId: number; versionId: number; layers: SeedLayer[] };

type TemplateLayer = Omit<SeedLayer, "id" | "components"> & { row: Record<string, unknown>; components: Record<string, unknown>[] };
type Template = { id: number; name: string; layers: TemplateLayer[] };

/** The demo shop's plan templates, read once: every bulk job's plan is a copy of one of them. */
export function loadTemplates(sqlite: Database.Database): Template[] {
  const plans = sqlite.prepare("select p.id, p.name, max(v.id) as versionId from plans p join plan_versions v on v.plan_id = p.id where p.is_template = 1 group by p.id order by p.id").all() as { id: number; name: string; versionId: number }[];
  const layers = sqlite.prepare("select * from plan_layers where version_id = ? order by position, id");
  const comps = sqlite.prepare("select * from layer_components where layer_id = ? order by position, id");
  return plans.map((p) => ({
    id: p.id,
    name: p.name,
    layers: (layers.all(p.versionId) as Record<string, unknown>[]).map((row) => ({
      row,
      kind: row.kind as string,
      coats: row.coats as number,
      minutesPerCoat: row.minutes_per_coat as number,
      flashMinutes: row.flash_minutes as number,
      dryMinutes: row.dry_minutes as number,
      components: comps.all(row.id) as Record<string, unknown>[],
    })),
  }));
}

/** Copies plans with prepared statements; each copy varies the coats a little, as real jobs do. */
export function planCopier(sqlite: Database.Database, rand: Rand, createdBy: string) {
  const insertPlan = sqlite.prepare(
    "insert into plans (name, description, job_id, is_template, copied_from_plan_id, created_by, created_at, updated_at) values (?, null, ?, 0, ?, ?, ?, ?)",
  );
  const insertVersion = sqlite.prepare("insert into plan_versions (plan_id, version, frozen_at, note, created_by, created_at) values (?, 1, null, null, ?, ?)");
  const insertLayer = sqlite.prepare(
    `insert into plan_layers (version_id, position, kind, name, coats, flash_minutes, minutes_per_coat, dry_minutes, gun_tip, pressure_psi, overlap_pct,
       dry_film_per_coat, dry_film_unit, transfer_efficiency_pct, notes)
     values (@versionId, @position, @kind, @name, @coats, @flash_minutes, @minutes_per_coat, @dry_minutes, @gun_tip, @pressure_psi, @overlap_pct,
       @dry_film_per_coat, @dry_film_unit, @transfer_efficiency_pct, @notes)`,
  );
  const insertComp = sqlite.prepare("insert into layer_components (layer_id, position, material_id, label, parts, percent, percent_of) values (?, ?, ?, ?, ?, ?, ?)");
  const coatsFor = (kind: string, base: number) =>
    kind === "candy" ? rand.int(4, 8) : kind === "ground_coat" ? rand.int(2, 3) : kind === "clear" ? rand.int(Math.max(2, base - 1), base + 1) : base;

  return (template: Template, jobId: number, at: number): SeedPlan => {
    const planId = Number(insertPlan.run(template.name, jobId, template.id, createdBy, at, at).lastInsertRowid);
    const versionId = Number(insertVersion.run(planId, createdBy, at).lastInsertRowid);
    const layers = template.layers.map((t) => {
      const coats = coatsFor(t.kind, t.coats);
      const id = Number(insertLayer.run({ ...t.row, id: undefined, version_id: undefined, versionId, coats }).lastInsertRowid);
      const components = t.components.map((c) => {
        insertComp.run(id, c.position, c.material_id, c.label, c.parts, c.percent, c.percent_of);
        return { materialId: c.material_id as number, label: c.label as string, parts: c.parts as number | null, percent: c.percent as number | null };
      });
      return { ...t, id, coats, components };
    });
    return { planId, versionId, layers };
  };
}
