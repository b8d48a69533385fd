import { readEnv } from "../config";
import { listBackups } from "../backups/backup-files";
import { resolveBackup, restoreBackup } from "../backups/restore-backup";

/**
 * `npm run restore -- <backup>`: puts a backup's database and uploads back. Stop the server first. Without an
 * argument, lists the backups in BACKUP_DIR.
 */
const env = readEnv();
const arg = process.argv[2];
if (!arg) {
  const all = listBackups(env.backupDir);
  console.log(all.length ? `Backups in ${env.backupDir} (newest first):` : `No backups in ${env.backupDir}.`);
  for (const b of all) console.log(`  ${b.name}  ${(b.totalBytes / 1e6).toFixed(1)} MB, ${b.uploads.files} uploaded files, app ${b.appVersion}`);
  console.log("Usage: npm run restore -- <backup name or folder>");
  process.exit(all.length ? 0 : 2);
}
try {
  const backup = resolveBackup(arg, env.backupDir);
  const result = restoreBackup(backup, { dbFile: env.dbFile, uploadsDir: env.uploadsDir });
  console.log(`Restored ${backup.info?.name ?? backup.dbPath} into ${env.dataDir}${result.restoredUploads ? " (database and uploads)" : " (database only; uploads left as they were)"}.`);
  if (result.setAside) console.log(`What it replaced was moved to ${result.setAside}; delete that folder once you are sure.`);
} catch (err) {
  console.error((err as Error).message);
  process.exit(1);
}
