import { describe, expect, it } from "vitest";
import request from "supertest";
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { makeShop, editAt } from "../support/test-app";
import { writeUpload } from "../support/backup-fixtures";

const pkg = JSON.parse(readFileSync(path.resolve(import.meta.dirname, "../../package.json"), "utf8")) as { version: string };

/** Free bytes as coreutils' df reports them for the folder (an outside measure of what statfs gives the app). */
const dfAvail = (dir: string) => Number(execFileSync("df", ["-B1", "--output=avail", dir], { encoding: "utf8" }).trim().split("\n")[1]);

describe("the owner's backups and disk panel", () => {
  it("shows the last backup's time and size and the free space in DATA_DIR, to the owner only", async () => {
    const s = await makeShop();
    writeUpload(s.app.deps.uploadsDir, "12121212121212121212121212121212.jpg", 120_000);
    const before = await s.as("owner").get("/api/dashboard");
    expect(before.body.system.backups).toMatchObject({ last: null, count: 0, everyHours: 24, keep: 14, lastFailure: null, dir: path.join(s.app.deps.dataDir, "backups") });

    const info = await s.app.deps.backups.run();
    const res = await s.as("owner").get("/api/dashboard");
    expect(res.status).toBe(200);
    const { backups, disk } = res.body.system;
    expect(backups.last).toEqual({ name: info.name, takenAt: info.takenAt, sizeBytes: info.db.bytes + 120_000, uploadFiles: 1 });
    expect(backups.count).toBe(1);
    expect(backups.overdue).toBe(false);

    // Free space agrees with df on the same folder (other programs write meanwhile: within 64 MB).
    expect(disk.dataDir).toBe(s.app.deps.dataDir);
    expect(Math.abs(disk.freeBytes - dfAvail(s.app.deps.dataDir))).toBeLessThan(64 * 1024 * 1024);
    expect(disk.sizeBytes).toBeGreaterThan(disk.freeBytes);
    // The default warning is 2 GB (10^9 bytes each).
    expect(disk.warnBelowBytes).toBe(2e9);
    expect(disk.low).toBe(disk.freeBytes < 2e9);

    // The estimator sees the jobs part, nothing about the machine.
    expect((await s.as("estimator").get("/api/dashboard")).body.system).toBeNull();
  });

  it("warns when free space falls below the shop's threshold, which the owner sets", async () => {
    const s = await makeShop();
    const free = (await s.as("owner").get("/api/dashboard")).body.system.disk.freeBytes as number;
    const aboveFree = Math.ceil(free / 1e9) + 1;
    const set = await editAt(s, "owner", "/api/settings", { lowDiskWarningGb: aboveFree });
    expect(set.status).toBe(200);
    expect(set.body.lowDiskWarningGb).toBe(aboveFree);
    const low = (await s.as("owner").get("/api/dashboard")).body.system.disk;
    expect(low).toMatchObject({ low: true, warnBelowBytes: aboveFree * 1e9 });

    expect((await editAt(s, "owner", "/api/settings", { lowDiskWarningGb: 0 })).status).toBe(200);
    expect((await s.as("owner").get("/api/dashboard")).body.system.disk.low).toBe(false);
  });

  it("refuses a negative or non-numeric threshold, naming the field", async () => {
    const s = await makeShop();
    for (const bad of [-1, "lots"]) {
      const res = await editAt(s, "owner", "/api/settings", { lowDiskWarningGb: bad });
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(["lowDiskWarningGb"]);
    }
    expect((await editAt(s, "estimator", "/api/settings", { lowDiskWarningGb: 5 })).status).toBe(403);
  });
});

describe("GET /api/health", () => {
  it("reports the version and the age of the last backup, to anyone, and nothing else", async () => {
    let now = Date.now();
    const s = await makeShop({ now: () => now });
    const none = await request(s.app).get("/api/health");
    expect(none.body).toEqual({ ok: true, version: pkg.version, time: new Date(now).toISOString(), demoMode: false, lastBackupAt: null, lastBackupAgeSeconds: null, backupFailing: false });

    const info = await s.app.deps.backups.run();
    now += 90_000;
    const res = await request(s.app).get("/api/health");
    expect(res.body).toEqual({
      ok: true,
      version: pkg.version,
      time: new Date(now).toISOString(),
      demoMode: false,
      lastBackupAt: info.takenAt,
      lastBackupAgeSeconds: 90,
      backupFailing: false,
    });
    // No paths, secrets or settings in it.
    const text = JSON.stringify(res.body);
    expect(text).not.toContain(s.app.deps.dataDir);
    expect(text).not.toContain(s.app.deps.appSecret);
    expect(text).not.toMatch(/backups|tmp|secret|password/i);
  });
});
