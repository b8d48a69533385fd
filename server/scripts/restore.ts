import Database from "better-sqlite3";
import { copyFileSync, existsSync, rmSync } from "node:fs";
import { readEnv } from "../config";

/**
 * `npm run restore -- <backup file>`: puts a backup back as the live database. Stop the server first:
 * the restore refuses while another process holds the database open for writing.
 */
export function restoreDatabase(backupFile: string, dbFile: string) {
  if (!existsSync(backupFile)) throw new Error(`No backup at ${backupFile}`);
  const src = new Database(backupFile, { readonly: true, fileMustExist: true });
  try {
    const check = src.pragma("integrity_check", { simple: true });
    if (check !== "ok") throw new Error(`The backup is damaged (${String(check)}); nothing was restored`);
  } finally {
    src.close();
  }
  if (existsSync(dbFile)) {
    // In WAL mode only exclusive locking mode fails while another connection (a running server) has the file open.
    const live = new Database(dbFile, { timeout: 0 });
    try {
      live.pragma("locking_mode = EXCLUSIVE");
      live.exec("BEGIN EXCLUSIVE; COMMIT;");
    } catch {
      throw new Error("The database is in use; stop the server before restoring");
    } finally {
      live.close();
    }
  }
  for (const suffix of ["-wal", "-shm"]) rmSync(dbFile + suffix, { force: true });
  copyFileSync(backupFile, dbFile);
  return dbFile;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const env = readEnv();
  const file = process.argv[2];
  if (!file) {
    console.error("Usage: npm run restore -- <backup file>");
    process.exit(2);
  }
  restoreDatabase(file, env.dbFile);
  console.log(`Restored ${file} into ${env.dbFile}`);
}
