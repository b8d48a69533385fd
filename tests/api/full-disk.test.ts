import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { existsSync, mkdirSync, readdirSync, rmSync, statSync } from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { makeShop } from "../support/test-app";
import { callRow, type MatrixCase, type MatrixRows, type Who } from "./matrix/rows";
import { fillDisk, mountTmpfs } from "../support/full-disk";

/**
 * A real full disk. The database and the uploads live on a small tmpfs; after the route's setup the disk is filled
 * to the last byte, then every write route is called once. Afterwards the disk is freed and the database reopened
 * from its file (a restart): a route that answered 2xx must have its change there, a route that was refused must
 * have answered 507 `storage_full` and changed nothing, in the database or in the uploads folder.
 * Each route also runs once on a disk with room (the control), which tells whether its success writes anything.
 */
const files = import.meta.glob<{ rows?: MatrixRows }>("./matrix/*.ts", { eager: true });
const MATRIX: MatrixRows = Object.assign({}, ...Object.values(files).map((m) => m.rows ?? {}));
const WRITES = Object.entries(MATRIX).filter(([key]) => !key.startsWith("GET "));
const CALLERS: Who[] = ["owner", "estimator", "painter", "customer", "anonymous"];

let disk: ReturnType<typeof mountTmpfs>;
let mountPoint: string;
beforeAll(() => {
  disk = mountTmpfs("12m");
  mountPoint = disk.dir;
});
afterAll(() => disk?.unmount());

/** Everything the shop holds: every table's rows, and the files in the uploads folder with their sizes. */
function snapshot(dbFile: string, uploadsDir: string) {
  const db = new Database(dbFile, { readonly: true });
  try {
    const tables = db.prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name NOT LIKE '__drizzle%' ORDER BY name").pluck().all() as string[];
    const rows = Object.fromEntries(tables.map((t) => [t, db.prepare(`SELECT * FROM "${t}" ORDER BY rowid`).all()]));
    const uploads = existsSync(uploadsDir) ? readdirSync(uploadsDir).map((f) => `${f}:${statSync(path.join(uploadsDir, f)).size}`).sort() : [];
    return JSON.stringify({ rows, uploads });
  } finally {
    db.close();
  }
}

type Outcome = { status: number; code?: string; before: string; after: string };

/** Sets a shop up in `dir` on the tmpfs, runs the route (on a full disk when asked), restarts and compares. */
async function run(dir: string, key: string, c: MatrixCase, who: Who, full: boolean): Promise<Outcome> {
  mkdirSync(dir);
  const dbFile = path.join(dir, "coatwright.db");
  const shop = await makeShop({ dbFile, dataDir: dir, demoMode: true, outboxDir: dir });
  const uploadsDir = shop.app.deps.uploadsDir;
  try {
    await c.prepare?.(shop);
    // Everything so far is in the main file and the write-ahead log is empty, so the next write needs new space.
    shop.db.$client.pragma("wal_checkpoint(TRUNCATE)");
    const before = snapshot(dbFile, uploadsDir);
    if (full) fillDisk(dir);
    const res = await callRow(shop, key, c, who);
    shop.db.$client.close();
    rmSync(path.join(dir, "filler"), { force: true });
    return { status: res.status, code: res.body?.error?.code, before, after: snapshot(dbFile, uploadsDir) };
  } finally {
    if (shop.db.$client.open) shop.db.$client.close();
    rmSync(dir, { recursive: true, force: true });
  }
}

describe("a full disk never gets a success for a write that did not land", () => {
  const refused: string[] = [];
  let n = 0;
  for (const [key, c] of WRITES) {
    const who = CALLERS.find((w) => c.expect[w] >= 200 && c.expect[w] < 300);
    if (!who) continue;
    it(`${key} (as ${who})`, async () => {
      const control = await run(path.join(mountPoint, `c${++n}`), key, c, who, false);
      expect(control.status, "with room on the disk the call succeeds").toBe(c.expect[who]);
      const writes = control.after !== control.before;

      const full = await run(path.join(mountPoint, `f${n}`), key, c, who, true);
      if (full.status >= 200 && full.status < 300) {
        // Acknowledged: after the restart the change is there (a call that writes nothing leaves nothing to find).
        expect(full.after !== full.before, `${key} answered ${full.status}: its change must survive the restart`).toBe(writes);
      } else {
        refused.push(key);
        expect({ status: full.status, code: full.code }).toEqual({ status: 507, code: "storage_full" });
        expect(full.after === full.before, `${key} was refused: nothing of it may be in the database or the uploads folder`).toBe(true);
      }
    });
  }

  it("the routes reported on a full disk are among those refused, and most writes were really tested", () => {
    for (const key of ["POST /api/materials/:id/lots", "PATCH /api/materials/:id/lots/:lotId", "POST /api/customers", "POST /api/uploads", "POST /api/materials/:id/files"]) expect(refused).toContain(key);
    expect(refused.length).toBeGreaterThan(WRITES.length / 2);
  });
});
