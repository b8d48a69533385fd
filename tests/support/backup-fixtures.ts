import { execFileSync } from "node:child_process";
import Database from "better-sqlite3";
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { MIGRATIONS_FOLDER, migrateDb, openDb } from "../../server/db/client";

/** A data folder with a migrated database file (WAL, like the server's) and an uploads folder. */
export function liveDataDir(parent = tmpdir()) {
  const dir = mkdtempSync(path.join(parent, "cw-backup-"));
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
  return {
    dir,
    unmount: () => {
      execFileSync("umount", [dir], { stdio: "ignore" });
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Whether this machine lets the tests mount a small disk (checked once, nothing left mounted). */
export const canMountSmallDisk = (() => {
  const probe = smallDisk("64k");
  probe?.unmount();
  return probe !== null;
})();

type Journal = { entries: { tag: string }[] };
const readJournal = () => JSON.parse(readFileSync(path.join(MIGRATIONS_FOLDER, "meta/_journal.json"), "utf8")) as Journal;

/** How many migrations this version ships. */
export const migrationCount = () => readJournal().entries.length;

/** The migrations folder as it was one release ago: the newest migration not there yet. */
export function olderRelease() {
  const journal = readJournal();
  const dir = mkdtempSync(path.join(tmpdir(), "cw-old-migrations-"));
  cpSync(MIGRATIONS_FOLDER, dir, { recursive: true });
  writeFileSync(path.join(dir, "meta/_journal.json"), JSON.stringify({ ...journal, entries: journal.entries.slice(0, -1) }));
  return dir;
}

/** How many migrations the database file has applied. */
export function appliedIn(file: string) {
  const db = new Database(file, { readonly: true });
  try {
    return (db.prepare("select count(*) as n from __drizzle_migrations").get() as { n: number }).n;
  } finally {
    db.close();
  }
}

/** The customers' names in a database file, in id order. */
export function customerNames(file: string) {
  const db = new Database(file, { readonly: true });
  try {
    return (db.prepare("select name from customers order by id").all() as { name: string }[]).map((r) => r.name);
  } finally {
    db.close();
  }
}
