import { afterEach, describe, expect, it } from "vitest";
import { mkdirSync, mkdtempSync, readdirSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { migrateDb, openDb } from "../../server/db/client";
import { appliedIn, customerNames, migrationCount, olderRelease } from "../support/backup-fixtures";
import { cleanUp, freePort, runTs, startServer, waitUp, type ServerProcess } from "../support/server-process";

let server: ServerProcess | undefined;
afterEach(() => cleanUp(server));

describe("upgrading and rolling back", () => {
  it("a new version backs up the old database before migrating it, and restoring that backup rolls the upgrade back", async () => {
    const root = mkdtempSync(path.join(tmpdir(), "cw-upgrade-run-"));
    const dataDir = path.join(root, "data");
    const backupDir = path.join(root, "backups");
    // The shop's data as last release left it.
    mkdirSync(dataDir, { recursive: true });
    const old = openDb(path.join(dataDir, "coatwright.db"));
    migrateDb(old, olderRelease());
    // Raw SQL: the older schema lacks columns the current one adds (Drizzle would name them all).
    old.$client.prepare("insert into customers (name) values (?)").run("From last year");
    old.$client.close();
    const total = migrationCount();
    const env = { DATA_DIR: dataDir, BACKUP_DIR: backupDir, BACKUP_EVERY_HOURS: "0" };

    // Start this version: it backs up, then migrates.
    server = startServer({ ...env, PORT: String(await freePort()) });
    await waitUp(server);
    const backups = readdirSync(backupDir);
    expect(backups).toHaveLength(1);
    expect(backups[0]).toMatch(/-pre-migration$/);
    const backupDb = path.join(backupDir, backups[0]!, "coatwright.db");
    expect(appliedIn(backupDb)).toBe(total - 1);
    expect(customerNames(backupDb)).toEqual(["From last year"]);
    expect(server.stdout()).toMatch(/backed up before applying 1 schema migration/);
    server.proc.kill("SIGTERM");
    expect((await server.exited).code).toBe(0);
    expect(appliedIn(path.join(dataDir, "coatwright.db"))).toBe(total);

    // Rolling back: restore the pre-migration backup (then run the old version).
    const restore = runTs("server/scripts/restore.ts", env, [backups[0]!]);
    expect((await restore.exited).code, restore.stderr()).toBe(0);
    expect(appliedIn(path.join(dataDir, "coatwright.db"))).toBe(total - 1);
    expect(customerNames(path.join(dataDir, "coatwright.db"))).toEqual(["From last year"]);
  }, 90_000);
});
