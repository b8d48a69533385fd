import { existsSync, readdirSync, readFileSync, rmSync, statSync } from "node:fs";
import path from "node:path";

/**
 * A backup is one folder in BACKUP_DIR, named for when it was taken and why:
 *   coatwright-2026-12-02T09-30-00-000Z-scheduled/
 *     coatwright.db    the database, copied online and integrity-checked
 *     uploads/         the uploads folder as it was just after the copy
 *     backup.json      the manifest, written last: a folder without one is not a backup
 * A backup being written is a `….partial` folder and is renamed only once it is complete and checked.
 */
export const BACKUP_KINDS = ["scheduled", "manual", "pre-migration"] as const;
export type BackupKind = (typeof BACKUP_KINDS)[number];

export const DB_FILE = "coatwright.db";
export const UPLOADS_DIR = "uploads";
export const MANIFEST_FILE = "backup.json";
const PARTIAL = ".partial";
const NAME = /^coatwright-(\d{4}-\d{2}-\d{2}T\d{2}-\d{2}-\d{2}-\d{3}Z)-(scheduled|manual|pre-migration)$/;

export type BackupManifest = {
  format: 1;
  kind: BackupKind;
  takenAt: string;
  appVersion: string;
  /** How many schema migrations the copied database had applied. */
  migrations: number;
  db: { file: typeof DB_FILE; bytes: number; integrity: "ok" };
  uploads: { files: number; bytes: number };
};

export type BackupInfo = BackupManifest & { name: string; path: string; dbPath: string; uploadsPath: string; totalBytes: number };

export function backupName(at: number, kind: BackupKind) {
  return `coatwright-${new Date(at).toISOString().replace(/[:.]/g, "-")}-${kind}`;
}

export const partialPath = (dir: string, name: string) => path.join(dir, name + PARTIAL);

/** Reads one backup folder; null when it is not a complete backup. */
export function readBackup(folder: string): BackupInfo | null {
  const name = path.basename(folder);
  if (!NAME.test(name)) return null;
  try {
    const manifest = JSON.parse(readFileSync(path.join(folder, MANIFEST_FILE), "utf8")) as BackupManifest;
    if (manifest.format !== 1 || !existsSync(path.join(folder, DB_FILE))) return null;
    return {
      ...manifest,
      name,
      path: folder,
      dbPath: path.join(folder, DB_FILE),
      uploadsPath: path.join(folder, UPLOADS_DIR),
      totalBytes: manifest.db.bytes + manifest.uploads.bytes,
    };
  } catch {
    return null;
  }
}

/** Every complete backup in `dir`, newest first. */
export function listBackups(dir: string): BackupInfo[] {
  let entries: string[];
  try {
    entries = readdirSync(dir);
  } catch {
    return []; // no folder yet, or something else in its place (a failed backup says so)
  }
  return entries
    .filter((n) => NAME.test(n))
    .sort()
    .reverse()
    .map((n) => readBackup(path.join(dir, n)))
    .filter((b): b is BackupInfo => b !== null);
}

/**
 * Keeps the newest `keep` backups of the regular kinds (scheduled and manual) and, separately, the newest `keep`
 * taken before migrations, so a burst of upgrades never pushes out the everyday backups or the reverse.
 */
export function pruneBackups(dir: string, keep: number): string[] {
  const all = listBackups(dir);
  const regular = all.filter((b) => b.kind !== "pre-migration");
  const beforeMigrations = all.filter((b) => b.kind === "pre-migration");
  const drop = [...regular.slice(keep), ...beforeMigrations.slice(keep)];
  for (const b of drop) rmSync(b.path, { recursive: true, force: true });
  return drop.map((b) => b.name);
}

/** Removes backups left half-written by a crash or a full disk. */
export function removePartials(dir: string) {
  if (!existsSync(dir) || !statSync(dir).isDirectory()) return;
  for (const n of readdirSync(dir)) if (n.endsWith(PARTIAL)) rmSync(path.join(dir, n), { recursive: true, force: true });
}
