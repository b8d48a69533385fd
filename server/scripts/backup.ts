import Database from "better-sqlite3";
import { existsSync } from "node:fs";
import { readEnv } from "../config";
import { pruneBackups } from "../backups/backup-files";
import { takeBackup } from "../backups/take-backup";

/**
 * `npm run backup`: a backup now, the same as a scheduled one (database through SQLite's online backup API,
 * integrity-checked, uploads copied beside it) into BACKUP_DIR. Safe while the server runs and writes.
 */
const env = readEnv();
if (!existsSync(env.dbFile)) {
  console.error(`No database at ${env.dbFile}`);
  process.exit(1);
}
const sqlite = new Database(env.dbFile, { fileMustExist: true });
sqlite.pragma("busy_timeout = 5000");
try {
  const info = await takeBackup({ sqlite, uploadsDir: env.uploadsDir, backupDir: env.backupDir, kind: "manual" });
  pruneBackups(env.backupDir, env.BACKUP_KEEP);
  console.log(`Backed up ${env.dbFile} and ${info.uploads.files} uploaded files to ${info.path}`);
} catch (err) {
  console.error(`The backup failed: ${(err as Error).message}`);
  process.exitCode = 1;
} finally {
  sqlite.close();
}
