/** The shapes the scheduling rules work on: plain numbers and ids, times in ms since the epoch. */

export type BoothHours = {
  /** Minutes after local midnight when spraying may start, and by when it must be done. */
  opensAtMinute: number;
  closesAtMinute: number;
  /** Days of the week the booth is worked, 0 = Sunday … 6 = Saturday. */
  workDays: readonly number[];
  /** IANA time zone of the booth's clock, e.g. "America/Chicago". */
  timeZone: string;
};

export type Booth = BoothHours & {
  id: number;
  name: string;
  /** Masking, mixing and gun set-up before the first coat. */
  setupMinutes: number;
  /** Whether parts may leave the booth to cure (a curing room, or outdoors); if not, a layer cures in the booth. */
  canCureOutside: boolean;
};

/** A layer of a job's finish plan, as far as the schedule cares. */
export type ScheduleLayer = {
  id: number;
  jobId: number;
  position: number;
  name: string;
  coats: number;
  /** Spraying time of one coat over the job's parts (from the plan). */
  minutesPerCoat: number;
  flashMinutes: number;
  dryMinutes: number;
  /** The material's recoat window after the layer's last coat, when its data sheet gives one. */
  recoatMinMinutes: number | null;
  recoatMaxMinutes: number | null;
};

export type ScheduleJob = {
  id: number;
  title: string;
  /** ISO date (YYYY-MM-DD) the customer expects the job; the day's end counts. */
  dueDate: string | null;
  /** When prep is (planned to be) signed off; null when not planned yet and not signed off. */
  prepReadyAt: number | null;
  /** Layers in plan order. Layers already sprayed are left out. */
  layers: readonly ScheduleLayer[];
};

export type Session = {
  id?: number;
  boothId: number;
  jobId: number;
  layerId: number;
  startsAt: number;
  endsAt: number;
};

export type ConflictKind = "booth_overlap" | "too_soon" | "too_late" | "out_of_order" | "due_at_risk" | "before_prep" | "outside_hours";

export type Conflict = {
  kind: ConflictKind;
  /** The sessions involved (their index in the list checked, and their id when saved). */
  sessions: number[];
  jobId: number;
  message: string;
};
