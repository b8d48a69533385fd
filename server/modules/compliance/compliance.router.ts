import { Router } from "express";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { query } from "../../http/validate";
import { toCsv } from "../../http/csv";
import { complianceQuerySchema } from "../../../shared/schemas/compliance.schema";
import { complianceLog } from "./compliance.service";
import { convertMass, convertVolume, gPerLToLbPerGal } from "../../../shared/mix/index";
import { sendFile } from "../../http/send-file";

export const CSV_COLUMNS = [
  "batch",
  "mixed_at",
  "job",
  "job_title",
  "layer",
  "coating_category",
  "volume_l",
  "volume_gal",
  "voc_g_per_l",
  "voc_lb_per_gal",
  "voc_kg",
  "voc_lb",
  "limit_g_per_l",
  "over_limit",
] as const;

export function complianceRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("office"), (req, res) => {
    res.json(complianceLog(deps, query(req, complianceQuerySchema)));
  });
  r.get("/export.csv", allow("office"), (req, res) => {
    const q = query(req, complianceQuerySchema);
    const log = complianceLog(deps, q);
    // Full precision in the file; rounding is for the screen.
    const rows = log.batches.map((b) => [
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
    sendFile(res, { data: toCsv([[...CSV_COLUMNS], ...rows]), mime: "text/csv; charset=utf-8", name: `voc-log-${q.from}-to-${q.to}.csv`, disposition: "attachment", kept: "generated" });
  });
  return r;
}
