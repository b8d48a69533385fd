import { afterAll, beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import { existsSync, mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { customers } from "../../server/db/schema";
import { takeBackup } from "../../server/backups/take-backup";
import { listBackups, pruneBackups, removePartials } from "../../server/backups/backup-files";
import { createBackupService } from "../../server/backups/backup-service";
import { resolveBackup, restoreBackup } from "../../server/backups/restore-backup";
import { createLogger, silentLogger } from "../../server/log/logger";
import { makeShop } from "../support/test-app";
import { canMountSmallDisk, customerNames as names, liveDataDir, smallDisk, writeUpload } from "../support/backup-fixtures";

const journal = JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../../drizzle/meta/_journal.json"), "utf8")) as { entries: unknown[] };
describe("taking a backup", () => {
  it("copies the live database online, checks it, copies the uploads beside it and describes it in a manifest", async () => {
    const live = liveDataDir();
    live.db.insert(customers).values({ name: "Kept in backup" }).run();
    const photo = writeUpload(live.uploadsDir, "0123456789abcdef0123456789abcdef.jpg", 50_000);
    const info = await takeBackup({ sqlite: live.db.$client, uploadsDir: live.uploadsDir, backupDir: live.backupDir, kind: "manual" });
    // The live database keeps changing after the backup.
    live.db.insert(customers).values({ name: "Added after backup" }).run();

    expect(info.name).toMatch(/^coatwright-\d{4}-\d{2}-\d{2}T\d{2}-\d{2}-\d{2}-\d{3}Z-manual$/);
    expect(readdirSync(live.backupDir)).toEqual([info.name]);
    const db = new Database(info.dbPath, { readonly: true });
    expect(db.pragma("integrity_check", { simple: true })).toBe("ok");
    db.close();
    expect(names(info.dbPath)).toEqual(["Kept in backup"]);
    expect(readFileSync(path.join(info.uploadsPath, "0123456789abcdef0123456789abcdef.jpg")).equals(photo)).toBe(true);
    const manifest = JSON.parse(readFileSync(path.join(info.path, "backup.json"), "utf8"));
    expect(manifest).toMatchObject({
      format: 1,
      kind: "manual",
      appVersion: JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../../package.json"), "utf8")).version,
      migrations: journal.entries.length,
      db: { file: "coatwright.db", bytes: statSync(info.dbPath).size, integrity: "ok" },
      uploads: { files: 1, bytes: 50_000 },
    });
    live.db.$client.close();
  });

  it("links uploads the previous backup already holds instead of copying them again", async () => {
    const live = liveDataDir();
    writeUpload(live.uploadsDir, "aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa.jpg", 20_000);
    const first = await takeBackup({ sqlite: live.db.$client, uploadsDir: live.uploadsDir, backupDir: live.backupDir, kind: "scheduled", now: Date.now() - 60_000 });
    writeUpload(live.uploadsDir, "bbbbbbbbbbbbbbbbbbbbbbbbbbbbbbbb.png", 30_000, 7);
    const second = await takeBackup({ sqlite: live.db.$client, uploadsDir: live.uploadsDir, backupDir: live.backupDir, kind: "scheduled" });
    const ino = (b: typeof first, n: string) => statSync(path.join(b.uploadsPath, n)).ino;
    expect(ino(second, "aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa.jpg")).toBe(ino(first, "aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa.jpg"));
    expect(statSync(path.join(second.uploadsPath, "bbbbbbbbbbbbbbbbbbbbbbbbbbbbbbbb.png")).nlink).toBe(1);
    expect(second.uploads).toEqual({ files: 2, bytes: 50_000 });
    expect(listBackups(live.backupDir).map((b) => b.name)).toEqual([second.name, first.name]);
    live.db.$client.close();
  });

  it("keeps BACKUP_KEEP regular backups, keeps those taken before migrations apart, and clears half-written ones", async () => {
    const live = liveDataDir();
    const t0 = Date.now() - 3_600_000;
    const take = (kind: "scheduled" | "manual" | "pre-migration", minute: number) =>
      takeBackup({ sqlite: live.db.$client, uploadsDir: live.uploadsDir, backupDir: live.backupDir, kind, now: t0 + minute * 60_000 });
    const made = [await take("scheduled", 1), await take("pre-migration", 2), await take("manual", 3), await take("scheduled", 4), await take("pre-migration", 5), await take("scheduled", 6)];
    mkdirSync(path.join(live.backupDir, "coatwright-2020-01-01T00-00-00-000Z-scheduled.partial"));
    const removed = pruneBackups(live.backupDir, 2);
    expect(removed.sort()).toEqual([made[0]!.name, made[2]!.name].sort());
    expect(listBackups(live.backupDir).map((b) => b.name)).toEqual([made[5]!.name, made[4]!.name, made[3]!.name, made[1]!.name]);
    removePartials(live.backupDir);
    expect(readdirSync(live.backupDir).some((n) => n.endsWith(".partial"))).toBe(false);
    live.db.$client.close();
  });
});

describe("the backup schedule", () => {
  it("backs up as soon as it starts when none exists, then on the interval, pruning as it goes", async () => {
    const live = liveDataDir();
    const service = createBackupService({ dir: live.backupDir, everyHours: 0.0003, keep: 2, sqlite: live.db.$client, uploadsDir: live.uploadsDir, log: silentLogger, now: Date.now });
    service.start();
    // 0.0003 h is about 1.1 s: a first backup at once, then about three more within 4 s, of which 2 are kept.
    await new Promise((r) => setTimeout(r, 4000));
    await service.stop();
    const kept = listBackups(live.backupDir);
    expect(kept).toHaveLength(2);
    expect(kept.every((b) => b.kind === "scheduled")).toBe(true);
    const gap = Date.parse(kept[0]!.takenAt) - Date.parse(kept[1]!.takenAt);
    expect(gap).toBeGreaterThanOrEqual(1080 - 5);
    expect(gap).toBeLessThan(2500);
    // Stopped means stopped: nothing more is taken.
    await new Promise((r) => setTimeout(r, 1500));
    expect(listBackups(live.backupDir).map((b) => b.name)).toEqual(kept.map((b) => b.name));
    live.db.$client.close();
  });

  it("counts the interval from the newest backup on disk, so a restart does not take an extra one", async () => {
    const live = liveDataDir();
    const last = await takeBackup({ sqlite: live.db.$client, uploadsDir: live.uploadsDir, backupDir: live.backupDir, kind: "scheduled" });
    const service = createBackupService({ dir: live.backupDir, everyHours: 1, keep: 5, sqlite: live.db.$client, uploadsDir: live.uploadsDir, log: silentLogger, now: Date.now });
    service.start();
    await new Promise((r) => setTimeout(r, 300));
    const status = service.status();
    await service.stop();
    expect(status.count).toBe(1);
    expect(Date.parse(status.nextAt!)).toBe(Date.parse(last.takenAt) + 3_600_000);
    expect(status.last?.name).toBe(last.name);
    expect(status.overdue).toBe(false);
    live.db.$client.close();
  });
});

describe("a failed backup", () => {
  it("is logged, leaves nothing half-written, shows on the owner's dashboard and in /api/health, and the next good one clears it", async () => {
    const raw: string[] = [];
    const logger = createLogger({ destination: { write: (s: string) => void raw.push(s) } });
    const s = await makeShop({ logger });
    const dir = s.app.deps.backups.settings.dir;
    // Something that is not a folder where the backups should go.
    writeFileSync(dir, "not a folder");
    await expect(s.app.deps.backups.run()).rejects.toThrow();
    const failure = raw.map((l) => JSON.parse(l)).find((l) => l.msg === "backup failed");
    expect(failure).toMatchObject({ level: 50, dir });
    expect(failure.err.message).toMatch(/EEXIST|ENOTDIR/);

    const owner = await s.as("owner").get("/api/dashboard");
    expect(owner.body.system.backups.lastFailure.message).toMatch(/EEXIST|ENOTDIR/);
    expect(owner.body.system.backups.last).toBeNull();
    expect((await request(s.app).get("/api/health")).body).toMatchObject({ backupFailing: true, lastBackupAt: null, lastBackupAgeSeconds: null });

    (await import("node:fs")).rmSync(dir);
    await s.app.deps.backups.run();
    const after = await s.as("owner").get("/api/dashboard");
    expect(after.body.system.backups.lastFailure).toBeNull();
    expect(after.body.system.backups.count).toBe(1);
    expect((await request(s.app).get("/api/health")).body.backupFailing).toBe(false);
  });

  // Mounted only when one of these runs, and always unmounted after.
  let disk: ReturnType<typeof smallDisk>;
  beforeAll(() => {
    if (canMountSmallDisk) disk = smallDisk("4m");
  });
  afterAll(() => disk?.unmount());
  it.skipIf(!canMountSmallDisk)("that would not fit on its disk is refused before anything is written, and the owner is told why", async () => {
    const live = liveDataDir();
    const dir = path.join(disk!.dir, "refused");
    const ok = await takeBackup({ sqlite: live.db.$client, uploadsDir: live.uploadsDir, backupDir: dir, kind: "scheduled", now: Date.now() - 60_000 });
    // 6 MB of photos cannot fit on a 4 MB disk.
    writeUpload(live.uploadsDir, "cccccccccccccccccccccccccccccccc.jpg", 6_000_000, 3);
    const service = createBackupService({ dir, everyHours: 24, keep: 5, sqlite: live.db.$client, uploadsDir: live.uploadsDir, log: silentLogger, now: Date.now });
    await expect(service.run("scheduled")).rejects.toThrow(/Not enough room for a backup in .*: it needs about [78] MB and [1-4] MB is free/);
    expect(readdirSync(dir)).toEqual([ok.name]);
    expect(service.status().lastFailure?.message).toMatch(/Not enough room/);
    live.db.$client.close();
  });

  it.skipIf(!canMountSmallDisk)("when the disk fills up part-way, leaves no partial folder and the earlier backups untouched", async () => {
    const live = liveDataDir();
    const dir = path.join(disk!.dir, "filled");
    const ok = await takeBackup({ sqlite: live.db.$client, uploadsDir: live.uploadsDir, backupDir: dir, kind: "scheduled", now: Date.now() - 60_000 });
    writeUpload(live.uploadsDir, "dddddddddddddddddddddddddddddddd.jpg", 6_000_000, 4);
    // Past the room check (as if something else filled the disk meanwhile): the copy itself runs out of space.
    await expect(takeBackup({ sqlite: live.db.$client, uploadsDir: live.uploadsDir, backupDir: dir, kind: "scheduled", checkRoom: false })).rejects.toThrow(/ENOSPC/);
    expect(readdirSync(dir)).toEqual([ok.name]);
    expect(listBackups(dir).map((b) => b.name)).toEqual([ok.name]);
    live.db.$client.close();
  });

  it.skipIf(!canMountSmallDisk)("on the data's own disk leaves a reserve for the shop's own writes", async () => {
    // Data and backups on one 4 MB disk: a backup of the empty shop (under 1 MB) would fit, but not with 64 MB left over.
    const live = liveDataDir(disk!.dir);
    await expect(takeBackup({ sqlite: live.db.$client, uploadsDir: live.uploadsDir, backupDir: live.backupDir, kind: "manual" })).rejects.toThrow(
      /it needs about [12] MB and [1-3] MB is free \(a backup never takes the last 64 MB of the disk the shop's data is on\)/,
    );
    expect(readdirSync(live.backupDir)).toEqual([]);
    live.db.$client.close();
  });
});

describe("restoring", () => {
  it("puts back the database and the uploads, and moves what it replaced aside", async () => {
    const live = liveDataDir();
    live.db.insert(customers).values({ name: "Kept in backup" }).run();
    const photo = writeUpload(live.uploadsDir, "dddddddddddddddddddddddddddddddd.jpg", 40_000, 5);
    const backup = await takeBackup({ sqlite: live.db.$client, uploadsDir: live.uploadsDir, backupDir: live.backupDir, kind: "manual" });
    live.db.insert(customers).values({ name: "Added after backup" }).run();
    writeUpload(live.uploadsDir, "eeeeeeeeeeeeeeeeeeeeeeeeeeeeeeee.jpg", 10_000, 6);
    // The server still has the database open: refused, nothing changed.
    expect(() => restoreBackup(resolveBackup(backup.name, live.backupDir), { dbFile: live.dbFile, uploadsDir: live.uploadsDir })).toThrow(/stop the server/);
    expect(readdirSync(live.uploadsDir)).toHaveLength(2);
    live.db.$client.close();

    const result = restoreBackup(resolveBackup(backup.name, live.backupDir), { dbFile: live.dbFile, uploadsDir: live.uploadsDir });
    expect(names(live.dbFile)).toEqual(["Kept in backup"]);
    expect(readdirSync(live.uploadsDir)).toEqual(["dddddddddddddddddddddddddddddddd.jpg"]);
    expect(readFileSync(path.join(live.uploadsDir, "dddddddddddddddddddddddddddddddd.jpg")).equals(photo)).toBe(true);
    // What was replaced is set aside, not lost.
    expect(names(path.join(result.setAside!, "coatwright.db"))).toEqual(["Kept in backup", "Added after backup"]);
    expect(readdirSync(path.join(result.setAside!, "uploads")).sort()).toEqual(["dddddddddddddddddddddddddddddddd.jpg", "eeeeeeeeeeeeeeeeeeeeeeeeeeeeeeee.jpg"]);
    // The backup itself is untouched and can be restored again.
    expect(listBackups(live.backupDir).map((b) => b.name)).toEqual([backup.name]);
  });

  it("refuses a damaged backup or one missing uploads, and leaves the live data alone", async () => {
    const live = liveDataDir();
    live.db.insert(customers).values({ name: "Live" }).run();
    writeUpload(live.uploadsDir, "ffffffffffffffffffffffffffffffff.jpg", 1000);
    const backup = await takeBackup({ sqlite: live.db.$client, uploadsDir: live.uploadsDir, backupDir: live.backupDir, kind: "manual" });
    live.db.$client.close();

    const bad = path.join(live.dir, "bad.db");
    writeFileSync(bad, "not a database at all".repeat(100));
    expect(() => restoreBackup(resolveBackup(bad, live.backupDir), { dbFile: live.dbFile, uploadsDir: live.uploadsDir })).toThrow(/damaged/);

    (await import("node:fs")).rmSync(path.join(backup.uploadsPath, "ffffffffffffffffffffffffffffffff.jpg"));
    expect(() => restoreBackup(resolveBackup(backup.path, live.backupDir), { dbFile: live.dbFile, uploadsDir: live.uploadsDir })).toThrow(/holds 0 files but 1/);

    expect(names(live.dbFile)).toEqual(["Live"]);
    expect(readdirSync(live.uploadsDir)).toEqual(["ffffffffffffffffffffffffffffffff.jpg"]);
    expect(existsSync(`${live.dbFile}.restoring`)).toBe(false);
  });
});
