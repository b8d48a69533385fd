import type { Stage } from "../domain/stages";
import type { MaterialCategory } from "../domain/materials";

export type DashboardJobRef = { id: number; title: string; customerName: string; stage: Stage; dueDate: string | null };

/** What the estimator sees: the jobs part. */
export type DashboardJobsDto = {
  byStage: { stage: Stage; count: number }[];
  dueThisWeek: DashboardJobRef[];
  overdue: DashboardJobRef[];
};

/** What only the owner sees: money and people. All money in integer cents. */
export type DashboardMoneyDto = {
  deposits: { receivedCents: number; refundedCents: number; outstandingCents: number; outstandingQuotes: number; flaggedPayments: number };
  /** Last 12 months: deposits received (net of refunds) and the quoted value of jobs delivered that month. */
  revenueByMonth: { month: string; depositsCents: number; deliveredCents: number }[];
  /** Cost of the material in recorded batches, last 12 months, by catalogue category. */
  materialSpendByCategory: { category: MaterialCategory; costCents: number }[];
  /** Spraying time from logged coats (each coat counts its layer's minutes per coat), last 30 days. */
  boothHoursByPainter: { painterId: string | null; painterName: string; hours: number; coats: number }[];
};

/** What only the owner sees about the machine: backups and the room left for the data. */
export type DashboardSystemDto = {
  backups: {
    dir: string;
    everyHours: number;
    keep: number;
    count: number;
    last: { name: string; takenAt: string; sizeBytes: number; uploadFiles: number } | null;
    lastFailure: { at: string; message: string } | null;
    overdue: boolean;
  };
  /** Free space for the data folder (null when the system cannot say), and the shop's warning threshold. */
  disk: { dataDir: string; freeBytes: number; sizeBytes: number; warnBelowBytes: number; low: boolean } | null;
};

export type DashboardDto = { generatedAt: string; jobs: DashboardJobsDto; money: DashboardMoneyDto | null; system: DashboardSystemDto | null };
