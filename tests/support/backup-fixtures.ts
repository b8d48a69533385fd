import { execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { migrateDb, openDb } from "../../server/db/client";

/** A data folder with a migrated database file (WAL, like the server's) and an uploads folder. */
export function liveDataDir() {
  const dir = mkdtempSync(path.join(tmpdir(), "cw-backup-"));
  const dbFile = path.join(dir, "coatwright.db");
  const uploadsDir = path.join(dir, "uploads");
  mkdirSync(uploadsDir, { recursive: true });
  const db = openDb(dbFile);
  migrateDb(db);
  return { dir, dbFile, uploadsDir, backupDir: path.join(dir, "backups"), db };
}

/** A file of `bytes` pseudo-random bytes (so nothing can compress or dedupe it), named like an upload. */
export function writeUpload(uploadsDir: string, name: string, bytes: number, seed = 1) {
  const buf = Buffer.alloc(bytes);
  let x = seed;
  for (let i = 0; i < bytes; i++) buf[i] = (x = (x * 1103515245 + 12345) & 0x7fffffff) >> 16;
  mkdirSync(uploadsDir, { recursive: true });
  writeFileSync(path.join(uploadsDir, name), buf);
  return buf;
}

/**
 * A real small disk: a tmpfs of `size` mounted at a new folder (needs root, as CI runs); null where mounting is
 * not allowed. Call the returned `unmount` when done.
 */
export function smallDisk(size: string): { dir: string; unmount: () => void } | null {
  const dir = mkdtempSync(path.join(tmpdir(), "cw-small-disk-"));
  try {
    execFileSync("mount", ["-t", "tmpfs", "-o", `size=${size}`, "tmpfs", dir], { stdio: "ignore" });
  } catch {
    return null;
  }
  return { dir, unmount: () => execFileSync("umount", [dir], { stdio: "ignore" }) };
}
