import { HardDrive } from "lucide-react";
import type { DashboardSystemDto } from "@shared/schemas/dashboard.schema";
import { Alert } from "@/components/ui/alert";
import { formatDateTime } from "@/utils/format-date";
import { formatBytes } from "@/utils/format-bytes";
import { formatNumber } from "@/utils/format-quantity";

const every = (hours: number) => (hours === 0 ? "off" : hours === 24 ? "daily" : hours >= 1 ? `every ${formatNumber(hours, 1)} h` : `every ${formatNumber(hours * 60, 1)} min`);

/** The owner's view of the machine: the last backup, a failed or missing one, and the room left on the disk. */
export function SystemStatus({ system }: { system: DashboardSystemDto }) {
  const { backups, disk } = system;
  return (
    <section aria-labelledby="dash-system" className="rounded-xl border border-primer-200 bg-white shadow-card">
      <h2 id="dash-system" className="flex items-center gap-2 border-b border-primer-200 px-4 py-3 text-lg font-semibold text-ink-950 sm:px-5">
        <HardDrive aria-hidden className="size-5 text-ink-600" />
        Backups and disk
      </h2>
      <div className="flex flex-col gap-4 px-4 py-4 sm:px-5">
        {backups.lastFailure ? (
          <Alert tone="error" title="The last backup failed">
            {formatDateTime(backups.lastFailure.at)}: {backups.lastFailure.message}. Check the backup folder and the free space; the next try comes
            soon.
          </Alert>
        ) : null}
        {!backups.lastFailure && backups.overdue ? (
          <Alert tone="warning" title="No recent backup">
            {backups.last ? `The newest backup is from ${formatDateTime(backups.last.takenAt)}.` : "No backup has been taken yet."} Backups are set to run{" "}
            {every(backups.everyHours)}.
          </Alert>
        ) : null}
        {disk?.low ? (
          <Alert tone="warning" title="The disk is nearly full">
            Only {formatBytes(disk.freeBytes)} is free for the data folder (the warning is set at {formatBytes(disk.warnBelowBytes)}). Free some room or
            move the data to a larger disk before writes start to fail.
          </Alert>
        ) : null}
        <dl className="grid gap-4 text-sm sm:grid-cols-3">
          <div>
            <dt className="font-medium text-primer-700">Last backup</dt>
            <dd className="mt-1 text-base font-semibold text-ink-950" data-testid="last-backup">
              {backups.last ? formatDateTime(backups.last.takenAt) : "None yet"}
            </dd>
            {backups.last ? (
              <dd className="text-primer-700">
                {formatBytes(backups.last.sizeBytes)} with {backups.last.uploadFiles} uploaded {backups.last.uploadFiles === 1 ? "file" : "files"}
              </dd>
            ) : null}
          </div>
          <div>
            <dt className="font-medium text-primer-700">Schedule</dt>
            <dd className="mt-1 text-base font-semibold text-ink-950">{every(backups.everyHours)}</dd>
            <dd className="text-primer-700">
              {backups.count} kept (up to {backups.keep}) in <span className="break-all">{backups.dir}</span>
            </dd>
          </div>
          <div>
            <dt className="font-medium text-primer-700">Free disk space</dt>
            <dd className="mt-1 text-base font-semibold text-ink-950" data-testid="free-space">
              {disk ? formatBytes(disk.freeBytes) : "Unknown"}
            </dd>
            {disk ? <dd className="text-primer-700">of {formatBytes(disk.sizeBytes)} on the data folder's disk</dd> : null}
          </div>
        </dl>
      </div>
    </section>
  );
}
