import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdirSync, rmSync } from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { sql } from "drizzle-orm";
import { integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { openDb } from "../../server/db/client";
import { fillDisk, mountTmpfs } from "../support/full-disk";

/**
 * The guard behind "every write lands or is refused": an INSERT … RETURNING read with `.get()` outside a
 * transaction must throw when its commit fails on a full disk, as `.run()` and `.all()` do.
 * (tests/api/full-disk.test.ts does the same route by route.) A real full disk: a 2 MB tmpfs.
 */
const notes = sqliteTable("notes", { id: integer("id").primaryKey(), body: text("body").notNull() });

let disk: ReturnType<typeof mountTmpfs>;
beforeAll(() => {
  disk = mountTmpfs("2m");
});
afterAll(() => disk?.unmount());

/** A WAL database with one table in `name`, then the disk filled to the last byte. */
function onFullDisk(name: string, open: (file: string) => Database.Database) {
  const dir = path.join(disk.dir, name);
  mkdirSync(dir);
  const file = path.join(dir, "t.db");
  const db = open(file);
  db.pragma("journal_mode = WAL");
  db.exec("CREATE TABLE notes (id INTEGER PRIMARY KEY, body TEXT NOT NULL)");
  db.pragma("wal_checkpoint(TRUNCATE)");
  fillDisk(dir);
  const free = () => rmSync(dir, { recursive: true, force: true });
  return { db, file, dir, free };
}

const storedCount = (file: string) => {
  const db = new Database(file, { readonly: true });
  try {
    return db.prepare("SELECT count(*) FROM notes").pluck().get() as number;
  } finally {
    db.close();
  }
};

describe("writes on a full disk", () => {
  it("plain better-sqlite3 hands back an id for a row it never stored (the trap guarded against)", () => {
    const { db, file, free } = onFullDisk("raw", (f) => new Database(f));
    let answered = 0;
    for (let i = 0; i < 20; i++) {
      try {
        if (db.prepare("INSERT INTO notes (body) VALUES (?) RETURNING id").get("a short note")) answered++;
      } catch {
        /* refused, as it should be */
      }
    }
    db.close();
    rmSync(path.join(path.dirname(file), "filler"));
    expect(answered).toBeGreaterThan(0);
    expect(storedCount(file)).toBe(0);
    free();
  });

  it("through openDb, .returning().get() throws SQLITE_FULL and stores nothing, like .run()", () => {
    const { db, file, free } = onFullDisk("app", (f) => openDb(f).$client);
    const drizzleDb = openDb(file);
    db.close();
    for (let i = 0; i < 20; i++) {
      expect(() => drizzleDb.insert(notes).values({ body: "a short note" }).returning().get()).toThrow(expect.objectContaining({ code: "SQLITE_FULL" }));
      expect(() => drizzleDb.insert(notes).values({ body: "a short note" }).run()).toThrow(expect.objectContaining({ code: "SQLITE_FULL" }));
    }
    drizzleDb.$client.close();
    rmSync(path.join(path.dirname(file), "filler"));
    expect(storedCount(file)).toBe(0);
    free();
  });

  it("RETURNING writes that succeed still answer their row", () => {
    const db = openDb(":memory:");
    db.run(sql`CREATE TABLE notes (id INTEGER PRIMARY KEY, body TEXT NOT NULL)`);
    expect(db.insert(notes).values({ body: "a" }).returning().get()).toEqual({ id: 1, body: "a" });
    expect(db.update(notes).set({ body: "b" }).where(sql`id = 1`).returning({ body: notes.body }).get()).toEqual({ body: "b" });
    expect(db.update(notes).set({ body: "c" }).where(sql`id = 99`).returning().get()).toBeUndefined();
    expect(db.select().from(notes).get()).toEqual({ id: 1, body: "b" });
  });
});
