import { Router } from "express";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { query } from "../../http/validate";
import { toCsv } from "../../http/csv";
import { complianceQuerySchema } from "../../../shared/schemas/compliance.schema";
import { complianceLog } from "./compliance.service";
import { convertMass, convertVolume, gPerLToLbPerGal } from "../../../shared/mix/index";
import { sendFile } from "../../http/send-file";

/**
 * The file's columns, units in each name, and the decimals each is measured to: volumes to the millilitre
 * (0.001 L, 0.0001 gal), VOC content to 0.1 g/L as data sheets give it (0.001 lb/gal), VOC mass to the gram
 * (0.001 kg, 0.001 lb). Null means text.
 */
export const CSV_DECIMALS = {
  batch: null,
  mixed_at: null,
  job: null,
  job_title: null,
  layer: null,
  coating_category: null,
  volume_l: 3,
  volume_gal: 4,
  voc_g_per_l: 1,
  voc_lb_per_gal: 3,
  voc_kg: 3,
  voc_lb: 3,
  limit_g_per_l: 1,
  over_limit: null,
} as const;
export const CSV_COLUMNS = Object.keys(CSV_DECIMALS) as (keyof typeof CSV_DECIMALS)[];

/** A number written to the decimals its column is measured to ("0.473", never 0.47317647299999993); text as it is. */
function cell(column: keyof typeof CSV_DECIMALS, value: string | number): string | number {
  const digits = CSV_DECIMALS[column];
  return digits == null || typeof value !== "number" ? value : value.toFixed(digits);
}

export function complianceRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("office"), (req, res) => {
    res.json(complianceLog(deps, query(req, complianceQuerySchema)));
  });
  r.get("/export.csv", allow("office"), (req, res) => {
    const q = query(req, complianceQuerySchema);
    const log = complianceLog(deps, q);
    const rows: (string | number)[][] = log.batches.map((b) => [
      b.id,
      b.mixedAt,
      b.jobId,
      b.jobTitle,
      b.layerName,
      b.layerKind,
      b.volumeL,
      b.volumeGal,
      b.voc?.gPerL ?? "",
      b.voc?.lbPerGal ?? "",
      b.vocMass.kg,
      b.vocMass.lb,
      b.limitGPerL ?? "",
      b.overLimit ? "yes" : "no",
    ]);
    // Solvent logged outside a batch: "S" before its id, the material in the layer column, its purpose as the category.
    for (const u of log.solventUses) {
      rows.push([`S${u.id}`, u.usedAt, u.jobId ?? "", u.jobTitle ?? "", `${u.materialCode} ${u.materialName}`, `solvent: ${u.purpose}`, u.volumeMl / 1000, convertVolume(u.volumeMl, "mL", "gallon"), u.vocGPerL ?? "", u.vocGPerL != null ? gPerLToLbPerGal(u.vocGPerL) : "", u.vocKg, convertMass(u.vocKg, "kg", "lb"), "", "no"]);
    }
    const data = toCsv([[...CSV_COLUMNS], ...rows.map((row) => row.map((v, i) => cell(CSV_COLUMNS[i]!, v)))]);
    sendFile(res, { data, mime: "text/csv; charset=utf-8", name: `voc-log-${q.from}-to-${q.to}.csv`, disposition: "attachment", kept: "generated" });
  });
  return r;
}
