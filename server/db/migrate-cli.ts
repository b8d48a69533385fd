import { mkdirSync } from "node:fs";
import { readEnv } from "../config";
import { openDb } from "./client";
import { migrateWithBackup } from "../backups/migrate-with-backup";
import { createLogger } from "../log/logger";

/** `npm run db:migrate`: the start-up migration on its own, with the same backup first when the schema changes. */
const env = readEnv();
mkdirSync(env.dataDir, { recursive: true });
const db = openDb(env.dbFile);
try {
  const backup = await migrateWithBackup(db, { uploadsDir: env.uploadsDir, backupDir: env.backupDir, keep: env.BACKUP_KEEP, log: createLogger({ level: "warn" }) });
  console.log(`Migrated ${env.dbFile}${backup ? `; the database as it was is backed up in ${backup.path}` : ""}`);
} catch (err) {
  console.error((err as Error).message);
  process.exitCode = 1;
} finally {
  db.$client.close();
}
