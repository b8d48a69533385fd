import { describe, expect, it } from "vitest";
import { mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import { backupDatabase } from "../../server/scripts/backup";
import { restoreDatabase } from "../../server/scripts/restore";
import { migrateDb, openDb } from "../../server/db/client";
import { customers } from "../../server/db/schema";

describe("backup and restore", () => {
  it("copies a live database consistently while it is open, and restores it after the server stops", async () => {
    const dir = mkdtempSync(path.join(tmpdir(), "cw-backup-"));
    const file = path.join(dir, "coatwright.db");
    const db = openDb(file);
    migrateDb(db);
    db.insert(customers).values({ name: "Kept in backup" }).run();
    const dest = await backupDatabase(file, path.join(dir, "backups", "b1.db"));
    // The live database keeps changing after the backup.
    db.insert(customers).values({ name: "Added after backup" }).run();
    expect(() => restoreDatabase(dest, file)).toThrow(/stop the server/);
    db.$client.close();

    restoreDatabase(dest, file);
    const restored = new Database(file, { readonly: true });
    const names = restored.prepare("select name from customers order by id").all() as { name: string }[];
    expect(names.map((n) => n.name)).toEqual(["Kept in backup"]);
    expect(restored.pragma("integrity_check", { simple: true })).toBe("ok");
    restored.close();
  });

  it("refuses a damaged backup and leaves the live database alone", async () => {
    const dir = mkdtempSync(path.join(tmpdir(), "cw-backup-"));
    const file = path.join(dir, "coatwright.db");
    const db = openDb(file);
    migrateDb(db);
    db.insert(customers).values({ name: "Live" }).run();
    db.$client.close();
    const bad = path.join(dir, "bad.db");
    (await import("node:fs")).writeFileSync(bad, "not a database at all".repeat(100));
    expect(() => restoreDatabase(bad, file)).toThrow();
    const live = new Database(file, { readonly: true });
    expect((live.prepare("select count(*) as n from customers").get() as { n: number }).n).toBe(1);
    live.close();
  });
});
