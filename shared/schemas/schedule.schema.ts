import { z } from "zod";
import type { ConflictKind } from "../schedule/types";
import { idSchema, patchSchemaOf, requiredText, versionSchema } from "./common.schema";

const HHMM = /^([01][0-9]|2[0-3]):[0-5][0-9]$/;
/** "07:30" ↔ 450 minutes after midnight. */
export const minuteOfDay = (hhmm: string) => Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3, 5));
export const hhmmOf = (minutes: number) => `${String(Math.floor(minutes / 60)).padStart(2, "0")}:${String(minutes % 60).padStart(2, "0")}`;

const timeOfDay = (label: string) => z.string({ error: `${label} is required` }).regex(HHMM, `${label} must be a time like 07:30`);
const isTimeZone = (tz: string) => {
  try {
    new Intl.DateTimeFormat("en-US", { timeZone: tz });
    return true;
  } catch {
    return false;
  }
};

const boothFields = z.object({
    name: requiredText(60, "Name"),
    setupMinutes: z.coerce.number({ error: "Set-up time must be a number of minutes" }).int("Set-up time is whole minutes").min(0, "Set-up time cannot be negative").max(480, "Set-up time is limited to 480 minutes").default(20),
    canCureOutside: z.boolean({ error: "Say whether parts can cure outside the booth" }).default(false),
    opensAt: timeOfDay("Opening time").default("07:00"),
    closesAt: timeOfDay("Closing time").default("17:00"),
    workDays: z.array(z.number().int().min(0).max(6), { error: "Working days must be a list of days" }).min(1, "Pick at least one working day").max(7).default([1, 2, 3, 4, 5]),
    timeZone: z.string({ error: "Time zone is required" }).max(64).refine(isTimeZone, "Time zone must be a zone like America/Chicago"),
    active: z.boolean().default(true),
});
export const boothInputSchema = boothFields.refine((b) => minuteOfDay(b.closesAt) > minuteOfDay(b.opensAt), { path: ["closesAt"], message: "Closing time must be after opening time" });
export type BoothInput = z.input<typeof boothInputSchema>;

export const updateBoothInputSchema = patchSchemaOf(boothFields)
  .extend({ version: versionSchema })
  .refine((b) => b.opensAt == null || b.closesAt == null || minuteOfDay(b.closesAt) > minuteOfDay(b.opensAt), { path: ["closesAt"], message: "Closing time must be after opening time" });

export type BoothDto = {
  id: number;
  version: number;
  name: string;
  setupMinutes: number;
  canCureOutside: boolean;
  opensAt: string;
  closesAt: string;
  workDays: number[];
  timeZone: string;
  active: boolean;
};

const instant = (label: string) => z.iso.datetime({ offset: true, error: `${label} must be a date and time like 2026-12-07T08:00:00Z` });

export const sessionInputSchema = z.object({
  boothId: idSchema,
  jobId: idSchema,
  layerId: idSchema,
  startsAt: instant("Start"),
});
export const updateSessionInputSchema = z
  .object({ boothId: idSchema.optional(), startsAt: instant("Start").optional(), version: versionSchema })
  .refine((v) => v.boothId != null || v.startsAt != null, { message: "Send a new booth or a new start" });

export const scheduleQuerySchema = z
  .object({ from: instant("From"), to: instant("To") })
  .refine((q) => Date.parse(q.to) > Date.parse(q.from), { path: ["to"], message: "To must be after from" })
  .refine((q) => Date.parse(q.to) - Date.parse(q.from) <= 62 * 86_400_000, { path: ["to"], message: "Ask for at most 62 days at a time" });

export const suggestInputSchema = z.object({
  from: instant("From").optional(),
  horizonDays: z.number().int().min(1, "Plan at least one day").max(56, "Plan at most 56 days ahead").default(28),
});

export const acceptSuggestionInputSchema = z.object({
  from: instant("From"),
  sessions: z.array(sessionInputSchema).max(2000, "Too many sessions at once"),
});

export const prepPlanInputSchema = z.object({ readyAt: instant("Prep ready").nullable() });

export type SessionDto = {
  id: number | null;
  /** The edit version of a saved session (null in a proposal). */
  version: number | null;
  boothId: number;
  jobId: number;
  jobTitle: string;
  layerId: number;
  layerName: string;
  layerPosition: number;
  startsAt: string;
  /** When the last coat is down; the rest of the session is cure time in the booth. */
  sprayEndsAt: string;
  endsAt: string;
  painterName: string | null;
};
export type ConflictDto = { kind: ConflictKind; jobId: number; sessionIds: (number | null)[]; message: string };
export type ScheduleDto = { from: string; to: string; booths: BoothDto[]; sessions: SessionDto[]; conflicts: ConflictDto[] };
export type SchedulableJobDto = {
  id: number;
  title: string;
  dueDate: string | null;
  stage: string;
  prepReadyAt: string | null;
  prepSignedOff: boolean;
  layers: { id: number; name: string; position: number; coats: number; scheduled: boolean }[];
};
export type SuggestionDto = { from: string; sessions: SessionDto[]; unplaced: { jobId: number; jobTitle: string; reason: string }[]; conflicts: ConflictDto[] };
