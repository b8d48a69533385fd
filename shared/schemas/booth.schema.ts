import { z } from "zod";
import { TEMP_UNITS, type TempUnit } from "../domain/temperature";
import type { LayerKind } from "../domain/layers";
import type { TimingBreach } from "../domain/booth-timing";
import type { PlanLayerDto } from "./plan.schema";
import type { PrepStatus } from "../domain/prep";
import type { Stage } from "../domain/stages";
import type { Substrate } from "../domain/substrates";
import { idSchema, madeAtSchema, optionalText, requiredText } from "./common.schema";
import { optionalNumber } from "./prep.schema";
import { checkTemp } from "./booth-conditions.schema";
import { checkSetup, spraySetupFields, type SpraySetupDto } from "./spray-setup.schema";
export { TEMP_LIMITS } from "./booth-conditions.schema";

const conditions = {
  boothTemp: optionalNumber("Booth temperature", -10, 140),
  tempUnit: z.enum(TEMP_UNITS, { error: "Temperature unit must be C or F" }).optional(),
  humidityPct: optionalNumber("Humidity", 0, 100),
  note: optionalText(500, "Note"),
};

/**
 * One tap on the booth card: the coat just sprayed. The painter comes from the server, and so does the time, unless
 * the tap was queued offline: then `at` is when it was made on the tablet.
 */
export const createCoatLogInputSchema = z
  .object({
    jobId: idSchema,
    layerId: idSchema,
    coatNumber: z.coerce.number({ error: "Coat number must be a number" }).int("Coat number is a whole number").min(1, "Coats start at 1").max(50, "At most 50 coats"),
    ...conditions,
    /** Needed only when an item's prep is not signed off before the first coat. */
    prepOverrideReason: optionalText(500, "Reason"),
    /** Needed only when the coat goes on against a timing rule (flash, dry, recoat window, induction, no batch). */
    timingOverrideReason: optionalText(500, "Reason"),
    /** The owner's reason for spraying a layer that a change waiting for the customer would alter. */
    changeOverrideReason: optionalText(500, "Reason"),
    /** The gun set-up really used (the booth card fills in the approved panel's as a start). */
    ...spraySetupFields,
    at: madeAtSchema,
  })
  .superRefine(checkTemp)
  .superRefine(checkSetup);
export type CreateCoatLogInput = z.input<typeof createCoatLogInputSchema>;

/** A correction is a new entry naming what it corrects; the original is never changed. */
export const correctCoatLogInputSchema = z
  .object({
    reason: requiredText(500, "Reason"),
    /** The coat was not sprayed (logged by mistake): it stops counting. */
    void: z.boolean({ error: "void must be true or false" }).default(false),
    /** The real time of the coat, when the tap came late. */
    at: z.iso.datetime({ error: "Use a date and time like 2026-12-31T10:15:00Z", offset: true }).optional(),
    ...conditions,
  })
  .superRefine(checkTemp)
  .refine((v) => v.void || v.at !== undefined || v.boothTemp !== undefined || v.humidityPct !== undefined || v.note !== undefined, {
    path: ["reason"],
    message: "Say what is corrected: the time, the temperature, the humidity or the note, or that the coat did not happen",
  });
export type CorrectCoatLogInput = z.input<typeof correctCoatLogInputSchema>;

export const listCoatLogsQuerySchema = z.object({ jobId: idSchema });

export type CoatLogDto = {
  id: number;
  jobId: number;
  layerId: number;
  layerName: string;
  coatNumber: number;
  /** When the coat was sprayed. */
  at: string;
  /** When this entry was written. */
  loggedAt: string;
  painterName: string | null;
  boothTemp: number | null;
  tempUnit: TempUnit | null;
  humidityPct: number | null;
  note: string | null;
  setup: SpraySetupDto;
  mixSheetId: number | null;
  prepOverrideReason: string | null;
  /** The coat went on against a timing rule: the painter's reason and the rules as they stood. */
  timingOverrideReason: string | null;
  timingBreaches: TimingBreach[] | null;
  correctsId: number | null;
  correctionReason: string | null;
  voids: boolean;
  /** counts: an original still in force; corrected: superseded by a later correction; voided; correction: the correcting entry. */
  status: "counts" | "corrected" | "voided" | "correction";
};

export type BoothComponentDto = {
  label: string;
  materialCode: string;
  materialName: string;
  parts: number | null;
  percent: number | null;
  percentOf: string[] | null;
};

/** A plan layer as the booth shows it: no film-build figures, no material costs, plus the coat progress. */
export type BoothLayerDto = Pick<
  PlanLayerDto,
  | "id"
  | "position"
  | "kind"
  | "name"
  | "coats"
  | "flashMinutes"
  | "minutesPerCoat"
  | "dryMinutes"
  | "inductionMinutes"
  | "recoatMinMinutes"
  | "recoatMaxMinutes"
  | "catalysed"
  | "gunTip" | "pressurePsi" | "overlapPct" | "notes" | "cautions"
> & {
  components: BoothComponentDto[];
  /** The mixed layer's VOC (g/L less water and exempt), the shop's limit for its category, and whether it is over. */
  vocGPerL: number | null;
  vocLimitGPerL: number | null;
  vocOverLimit: boolean;
  /** A prep layer is done through the item prep records, not logged coat by coat. */
  isPrep: boolean;
  coatsDone: number;
  status: "done" | "current" | "upcoming";
  /** A change order the customer has not approved yet would alter this layer: no coats without the owner's reason. */
  changeWaiting: boolean;
};

export type BoothMixSheetDto = {
  id: number;
  layerId: number;
  status: "draft" | "mixed" | "void";
  /** Batch volume, mL, and the unit the painter measures in. */
  volumeMl: number;
  unit: string;
  mixedAt: string | null;
  mixedByName: string | null;
  potLifeMinutes: number | null;
  potLifeEndsAt: string | null;
  /** Planned volume in mL and in the sheet's unit, and its share of the ready-to-spray batch in %; what was really poured (mL). */
  lines: {
    label: string;
    materialCode: string;
    materialName: string;
    plannedMl: number;
    plannedInUnit: number;
    readyPct: number | null;
    actualMl: number | null;
    lotNumber: string | null;
  }[];
};

export type BoothTimerDto = { kind: "flash" | "dry"; startedAt: string; endsAt: string };

/** The timing windows of the next coat (shared/domain/booth-timing.ts), as times. */
export type CoatWindowsDto = {
  flashEndsAt: string | null;
  dryEndsAt: string | null;
  recoatClosesAt: string | null;
  inductionEndsAt: string | null;
  needsBatch: boolean;
};

export type BoothNextDto =
  | { state: "no_plan" }
  | { state: "no_layers" }
  | {
      state: "spray";
      layerId: number;
      layerName: string;
      layerKind: LayerKind;
      coat: number;
      of: number;
      isLastLayer: boolean;
      isFirstCoatOfJob: boolean;
      timer: BoothTimerDto | null;
      layerDoneAt: string;
      windows: CoatWindowsDto;
      /** The timing rules a coat now would break (the server refuses it without a reason). */
      breaches: TimingBreach[];
    }
  | { state: "done"; lastCoatAt: string; timer: BoothTimerDto };

export type BoothDto = {
  /** The server's clock when this was built, so a tablet with a wrong clock still counts down correctly. */
  serverNow: string;
  job: {
    id: number;
    title: string;
    stage: Stage;
    customerName: string;
    dueDate: string | null;
    assignedPainterName: string | null;
    /** The agreed colour, with the set-up it was sprayed with: the target the booth card shows and prefills. */
    approvedPanel: { id: number; label: string; thumbUrl: string | null; planLayerId: number | null; setup: SpraySetupDto } | null;
    /** The shop requires the customer's approval of a test panel before the first colour coat, and it has not come yet. */
    colourWaitsForCustomer: boolean;
  };
  /** Whether this user may log coats here (painters on their jobs and the owner; estimators read only). */
  canLog: boolean;
  /** Only the owner may spray a layer held by a change waiting for the customer (with a reason). */
  canOverrideChange: boolean;
  /** The shop's guns in use, to say which one sprayed a coat. */
  guns: { id: number; name: string }[];
  items: { id: number; name: string; substrate: Substrate; needsAdhesionPromoter: boolean; prepStatus: PrepStatus; prepRecordId: number | null }[];
  prepReady: boolean;
  plan: { planId: number; name: string; versionId: number; version: number; frozen: boolean } | null;
  layers: BoothLayerDto[];
  /** Change orders waiting for the customer (drafts and sent ones) that hold layers of this card. */
  changesWaiting: number[];
  mixSheets: BoothMixSheetDto[];
  /** The latest batch recorded as mixed for the current layer, with its pot-life end. */
  openBatch: { mixSheetId: number; layerId: number; mixedAt: string; potLifeEndsAt: string | null } | null;
  coatLogs: CoatLogDto[];
  next: BoothNextDto;
  /** Booth conditions of the last entry (this job's, else the shop's), to prefill the next one. */
  lastConditions: { boothTemp: number | null; tempUnit: TempUnit | null; humidityPct: number | null } | null;
  prepOverrides: { coatLogId: number; reason: string; byName: string | null; at: string }[];
  /** Coats that went on against a timing rule, with the painter's reason. */
  timingOverrides: { coatLogId: number; layerName: string; coatNumber: number; reason: string; breaches: TimingBreach[]; byName: string | null; at: string }[];
};

/** The printable job ticket: what the booth needs on paper, and a QR code that opens the booth card. */
export type JobTicketDto = {
  job: { id: number; title: string; stage: Stage; customerName: string; dueDate: string | null; assignedPainterName: string | null };
  items: { name: string; substrate: Substrate; surfaceArea: number; areaUnit: "m2" | "ft2" }[];
  /** `cautions`: titles of the layer's hazards (isocyanates, flammable solvents); empty when none. */
  layers: { position: number; kind: LayerKind; name: string; coats: number; flashMinutes: number; dryMinutes: number; cautions: string[] }[];
  boothUrl: string;
  /** PNG data URL of the QR code for boothUrl. */
  qrDataUrl: string;
  printedAt: string;
};
