import Database from "better-sqlite3";
import { existsSync, mkdirSync } from "node:fs";
import path from "node:path";
import { readEnv } from "../config";

/**
 * `npm run backup [-- <file>]`: a consistent copy of the live database through SQLite's online backup API,
 * safe while the server is running and writing. Default file: DATA_DIR/backups/coatwright-<time>.db.
 */
export async function backupDatabase(dbFile: string, dest: string) {
  if (!existsSync(dbFile)) throw new Error(`No database at ${dbFile}`);
  mkdirSync(path.dirname(dest), { recursive: true });
  const db = new Database(dbFile, { fileMustExist: true });
  try {
    db.pragma("busy_timeout = 5000");
    await db.backup(dest);
  } finally {
    db.close();
  }
  const copy = new Database(dest, { readonly: true });
  try {
    const check = copy.pragma("integrity_check", { simple: true });
    if (check !== "ok") throw new Error(`Backup failed its integrity check: ${String(check)}`);
  } finally {
    copy.close();
  }
  return dest;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const env = readEnv();
  const stamp = new Date().toISOString().replace(/[:.]/g, "-");
  const dest = path.resolve(process.argv[2] ?? path.join(env.dataDir, "backups", `coatwright-${stamp}.db`));
  await backupDatabase(env.dbFile, dest);
  console.log(`Backed up ${env.dbFile} to ${dest}`);
}
