import { aliasedTable, asc, desc, eq,  placeholder } from "drizzle-orm";
import type { AppDeps } from "../../deps";
import { coatLogs, materials, mixSheetLines, mixSheets, users } from "../../db/schema";
import { iso, isoOrNull } from "../../http/dates";
import { preparedQuery } from "../../db/prepared";
import { gunNames } from "../guns/guns.service";
import { setupOf } from "../guns/spray-setup";
import { convertVolume, isVolumeUnit, potLifeEnds } from "../../../shared/mix/index";
import { effectiveCoats, type CoatEntry } from "../../../shared/domain/booth";
import type { TimingBreach } from "../../../shared/domain/booth-timing";
import type { BoothMixSheetDto, CoatLogDto } from "../../../shared/schemas/booth.schema";

/** The booth card's records of a job: its coat-log entries and its batches, as the card shows them. */

type CoatRow = typeof coatLogs.$inferSelect;

const painterOf = aliasedTable(users, "coat_painter");

const coatRowsQuery = preparedQuery((db) =>
  db
    .select({ c: coatLogs, painterName: painterOf.name })
    .from(coatLogs)
    .leftJoin(painterOf, eq(coatLogs.painterId, painterOf.id))
    .where(eq(coatLogs.jobId, placeholder("jobId")))
    .orderBy(asc(coatLogs.id))
    .prepare(),
);
export const coatRows = (deps: AppDeps, jobId: number) => coatRowsQuery(deps.db).all({ jobId });

export const asEntry = (c: CoatRow): CoatEntry => ({ id: c.id, layerId: c.layerId, coatNumber: c.coatNumber, at: c.at, correctsId: c.correctsId, voids: c.voids });

export function coatDtos(deps: AppDeps, rows: { c: CoatRow; painterName: string | null }[], layerNames: Map<number, string>): CoatLogDto[] {
  const guns = rows.some((r) => r.c.gunId != null) ? gunNames(deps) : new Map<number, string>();
  const effective = new Map(effectiveCoats(rows.map((r) => asEntry(r.c))).map((e) => [e.id, e]));
  const voided = new Set(rows.filter((r) => r.c.voids && r.c.correctsId != null).map((r) => r.c.correctsId!));
  return rows.map(({ c, painterName }) => ({
    id: c.id,
    jobId: c.jobId,
    layerId: c.layerId,
    layerName: layerNames.get(c.layerId) ?? "Layer of an earlier plan version",
    coatNumber: c.coatNumber,
    at: iso(c.at),
    loggedAt: iso(c.createdAt),
    painterName,
    boothTemp: c.boothTemp,
    tempUnit: c.tempUnit,
    humidityPct: c.humidityPct,
    note: c.note,
    setup: setupOf(c, guns),
    mixSheetId: c.mixSheetId,
    prepOverrideReason: c.prepOverrideReason,
    timingOverrideReason: c.timingOverrideReason,
    timingBreaches: (c.timingBreaches as TimingBreach[] | null) ?? null,
    correctsId: c.correctsId,
    correctionReason: c.correctionReason,
    voids: c.voids,
    status: c.correctsId != null ? "correction" : voided.has(c.id) ? "voided" : effective.get(c.id)?.correctedBy ? "corrected" : "counts",
  }));
}

const mixer = aliasedTable(users, "mixer");
const sheetsQuery = preparedQuery((db) =>
  db
    .select({ s: mixSheets, mixedByName: mixer.name })
    .from(mixSheets)
    .leftJoin(mixer, eq(mixSheets.mixedBy, mixer.id))
    .where(eq(mixSheets.jobId, placeholder("jobId")))
    .orderBy(desc(mixSheets.createdAt), desc(mixSheets.id))
    .prepare(),
);
const sheetLinesQuery = preparedQuery((db) =>
  db
    .select({
      sheetId: mixSheetLines.mixSheetId,
      position: mixSheetLines.position,
      label: mixSheetLines.label,
      materialCode: materials.code,
      materialName: materials.name,
      plannedMl: mixSheetLines.plannedMl,
      actualMl: mixSheetLines.actualMl,
      lotNumber: mixSheetLines.lotNumber,
    })
    .from(mixSheetLines)
    .innerJoin(mixSheets, eq(mixSheetLines.mixSheetId, mixSheets.id))
    .innerJoin(materials, eq(mixSheetLines.materialId, materials.id))
    .where(eq(mixSheets.jobId, placeholder("jobId")))
    .orderBy(asc(mixSheetLines.position))
    .prepare(),
);

export function mixSheetDtos(deps: AppDeps, jobId: number): BoothMixSheetDto[] {
  const sheets = sheetsQuery(deps.db).all({ jobId });
  const lines = sheets.length ? sheetLinesQuery(deps.db).all({ jobId }) : [];
  return sheets.map(({ s, mixedByName }) => {
    const unit = s.unit;
    const potEnd = s.mixedAt != null && s.potLifeMinutes != null && s.potLifeMinutes > 0 ? potLifeEnds(new Date(s.mixedAt), s.potLifeMinutes).toISOString() : null;
    return {
      id: s.id,
      layerId: s.layerId,
      status: s.status,
      volumeMl: s.totalMl,
      unit,
      mixedAt: isoOrNull(s.mixedAt),
      mixedByName: s.mixedAt ? mixedByName : null,
      potLifeMinutes: s.potLifeMinutes,
      potLifeEndsAt: potEnd,
      lines: lines
        .filter((l) => l.sheetId === s.id)
        .map((l) => ({
          label: l.label,
          materialCode: l.materialCode,
          materialName: l.materialName,
          readyPct: s.totalMl > 0 ? (l.plannedMl / s.totalMl) * 100 : null,
          plannedMl: l.plannedMl,
          plannedInUnit: isVolumeUnit(unit) ? convertVolume(l.plannedMl, "mL", unit) : l.plannedMl,
          actualMl: l.actualMl,
          lotNumber: l.lotNumber,
        })),
    };
  });
}

