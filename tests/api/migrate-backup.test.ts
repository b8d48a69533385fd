import { describe, expect, it } from "vitest";
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import { migrateDb, openDb } from "../../server/db/client";
import { migrateWithBackup, pendingMigrations } from "../../server/backups/migrate-with-backup";
import { listBackups } from "../../server/backups/backup-files";
import { silentLogger } from "../../server/log/logger";
import { appliedIn, liveDataDir, migrationCount, olderRelease, writeUpload } from "../support/backup-fixtures";

const total = migrationCount();

/** A shop's data folder on last release's schema, with a customer and a photo. */
function shopOnLastRelease() {
  const dir = mkdtempSync(path.join(tmpdir(), "cw-upgrade-"));
  const dbFile = path.join(dir, "coatwright.db");
  const db = openDb(dbFile);
  migrateDb(db, olderRelease());
  // Raw SQL: the older schema lacks columns the current one adds (Drizzle would name them all).
  db.$client.prepare("insert into customers (name) values (?)").run("From last year");
  const uploadsDir = path.join(dir, "uploads");
  mkdirSync(uploadsDir, { recursive: true });
  const photo = writeUpload(uploadsDir, "abababababababababababababababab.jpg", 30_000);
  return { dir, dbFile, db, uploadsDir, backupDir: path.join(dir, "backups"), photo };
}

describe("migrations at start-up", () => {
  it("back up the database and uploads first whenever they are about to change the schema", async () => {
    const shop = shopOnLastRelease();
    expect(pendingMigrations(shop.db)).toBe(1);
    const backup = await migrateWithBackup(shop.db, { uploadsDir: shop.uploadsDir, backupDir: shop.backupDir, keep: 14, log: silentLogger });
    expect(backup?.kind).toBe("pre-migration");
    // The backup holds the database as it was: last release's schema and the shop's records; and the photos.
    expect(appliedIn(backup!.dbPath)).toBe(total - 1);
    expect(backup!.migrations).toBe(total - 1);
    const copy = new Database(backup!.dbPath, { readonly: true });
    expect(copy.pragma("integrity_check", { simple: true })).toBe("ok");
    expect(copy.prepare("select name from customers").all()).toEqual([{ name: "From last year" }]);
    copy.close();
    expect(readFileSync(path.join(backup!.uploadsPath, "abababababababababababababababab.jpg")).equals(shop.photo)).toBe(true);
    // And the live database is now on the new schema, records kept.
    expect(pendingMigrations(shop.db)).toBe(0);
    shop.db.$client.close();
    expect(appliedIn(shop.dbFile)).toBe(total);
  });

  it("take no backup when nothing is pending, or when the database is brand new", async () => {
    const live = liveDataDir(); // already migrated
    expect(await migrateWithBackup(live.db, { uploadsDir: live.uploadsDir, backupDir: live.backupDir, keep: 14, log: silentLogger })).toBeNull();
    const fresh = openDb(path.join(live.dir, "fresh.db"));
    expect(pendingMigrations(fresh)).toBe(total);
    expect(await migrateWithBackup(fresh, { uploadsDir: live.uploadsDir, backupDir: live.backupDir, keep: 14, log: silentLogger })).toBeNull();
    expect(pendingMigrations(fresh)).toBe(0);
    expect(listBackups(live.backupDir)).toEqual([]);
    live.db.$client.close();
    fresh.$client.close();
  });

  it("refuse to change the schema when the backup cannot be made", async () => {
    const shop = shopOnLastRelease();
    writeFileSync(shop.backupDir, "a file where the backup folder should be");
    await expect(migrateWithBackup(shop.db, { uploadsDir: shop.uploadsDir, backupDir: shop.backupDir, keep: 14, log: silentLogger })).rejects.toThrow(
      /Could not back up the database before upgrading its schema, so nothing was changed/,
    );
    expect(pendingMigrations(shop.db)).toBe(1);
    shop.db.$client.close();
    expect(appliedIn(shop.dbFile)).toBe(total - 1);
  });
});
