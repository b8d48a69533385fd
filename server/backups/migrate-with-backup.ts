import { readMigrationFiles } from "drizzle-orm/migrator";
import type { Db } from "../db/client";
import { MIGRATIONS_FOLDER, migrateDb } from "../db/client";
import type { Logger } from "../log/logger";
import { pruneBackups } from "./backup-files";
import { takeBackup } from "./take-backup";
import type { BackupInfo } from "./backup-files";

/**
 * How many of the migrations in `folder` the database has not applied yet, by the rule Drizzle's migrator uses
 * (a migration runs when it is newer than the newest one recorded in `__drizzle_migrations`).
 */
export function pendingMigrations(db: Db, folder = MIGRATIONS_FOLDER): number {
  const sqlite = db.$client;
  const hasJournal = sqlite.prepare("select 1 from sqlite_master where type = 'table' and name = '__drizzle_migrations'").get();
  const last = hasJournal ? (sqlite.prepare("select max(created_at) as at from __drizzle_migrations").get() as { at: number | null }).at : null;
  return readMigrationFiles({ migrationsFolder: folder }).filter((m) => last === null || Number(last) < m.folderMillis).length;
}

const hasAnyTable = (db: Db) => db.$client.prepare("select 1 from sqlite_master where type = 'table' and name not like 'sqlite_%'").get() !== undefined;

/**
 * Brings the schema up to date, taking a backup (database and uploads) first whenever a migration is about to
 * change an existing database. If that backup cannot be made, nothing is migrated and the error says why: the
 * shop never runs a new schema it has no way back from. A brand-new, empty database needs no backup.
 */
export async function migrateWithBackup(
  db: Db,
  options: { uploadsDir: string; backupDir: string; keep: number; log: Logger; migrationsFolder?: string; now?: () => number },
): Promise<BackupInfo | null> {
  const folder = options.migrationsFolder ?? MIGRATIONS_FOLDER;
  const pending = pendingMigrations(db, folder);
  let backup: BackupInfo | null = null;
  if (pending > 0 && hasAnyTable(db)) {
    try {
      backup = await takeBackup({ sqlite: db.$client, uploadsDir: options.uploadsDir, backupDir: options.backupDir, kind: "pre-migration", now: options.now?.() });
    } catch (err) {
      throw new Error(`Could not back up the database before upgrading its schema, so nothing was changed: ${(err as Error).message}`, { cause: err });
    }
    pruneBackups(options.backupDir, options.keep);
    options.log.info({ backup: backup.name, pending }, `backed up before applying ${pending} schema migration(s)`);
  }
  if (pending > 0) migrateDb(db, folder);
  return backup;
}
