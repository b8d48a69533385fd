/** GET /api/health: what a local monitor may poll without signing in. */
export type HealthDto = {
  ok: boolean;
  version: string;
  time: string;
  demoMode: boolean;
  /** When the newest backup was taken, and how many seconds ago; null when there is none. */
  lastBackupAt: string | null;
  lastBackupAgeSeconds: number | null;
  /** The last backup attempt failed (the owner's dashboard says why). */
  backupFailing: boolean;
};
