import { afterEach, describe, expect, it } from "vitest";
import { existsSync, mkdtempSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { swatchPng } from "../support/booth-fixtures";
import { cleanUp, freePort, runTs, signIn, startServer, waitUp, type ServerProcess } from "../support/server-process";

/**
 * The restore drill, end to end on the real server and the real scripts: write records and photos, back up with
 * `npm run backup` while the server runs, stop, lose the whole data folder, `npm run restore -- <backup>`, start
 * again, and find everything.
 */
let server: ServerProcess | undefined;
afterEach(() => cleanUp(server));

describe("restore drill", () => {
  it("brings back the database and the uploads after the data folder is lost", async () => {
    const root = mkdtempSync(path.join(tmpdir(), "cw-drill-"));
    const dataDir = path.join(root, "data");
    const backupDir = path.join(root, "external-disk", "backups");
    const env = { DATA_DIR: dataDir, BACKUP_DIR: backupDir, BACKUP_EVERY_HOURS: "0", SIGNIN_LIMIT_PER_ADDRESS: "1000" };
    server = startServer({ ...env, PORT: String(await freePort()) });
    await waitUp(server);
    let base = server.base;
    let cookie = await signIn(base, "owner@demo.coatwright.test");
    const post = (url: string, body: object) => fetch(`${base}${url}`, { method: "POST", headers: { "content-type": "application/json", cookie }, body: JSON.stringify(body) });
    const get = (url: string) => fetch(`${base}${url}`, { headers: { cookie } });

    // Records and a photo.
    const customer = (await (await post("/api/customers", { name: "Drill Customer Ostrander", email: "ostrander@example.test" })).json()) as { id: number };
    const job = (await (await post("/api/jobs", { customerId: customer.id, title: "Drill: tank in candy plum" })).json()) as { id: number };
    const form = new FormData();
    form.set("ownerType", "job");
    form.set("ownerId", String(job.id));
    form.set("caption", "Before sanding");
    form.set("file", new Blob([await swatchPng({ r: 90, g: 20, b: 110 }, 200)], { type: "image/png" }), "tank.png");
    const upload = await fetch(`${base}/api/uploads`, { method: "POST", headers: { cookie }, body: form });
    expect(upload.status).toBe(201);
    const photo = (await upload.json()) as { id: number };
    const photoBytes = Buffer.from(await (await get(`/api/uploads/${photo.id}`)).arrayBuffer());
    const thumbBytes = Buffer.from(await (await get(`/api/uploads/${photo.id}/thumb`)).arrayBuffer());
    expect(photoBytes.length).toBeGreaterThan(100);
    const jobCount = async () => ((await (await get("/api/jobs?pageSize=1")).json()) as { total: number }).total;
    const jobsBefore = await jobCount();
    expect(jobsBefore).toBeGreaterThan(1);

    // Back up while the server runs.
    const backup = runTs("server/scripts/backup.ts", env);
    expect((await backup.exited).code, backup.stderr()).toBe(0);
    const [name] = readdirSync(backupDir);
    expect(name).toMatch(/-manual$/);

    // Stop, and lose the whole data folder.
    server.proc.kill("SIGTERM");
    expect((await server.exited).code).toBe(0);
    rmSync(dataDir, { recursive: true, force: true });
    expect(existsSync(dataDir)).toBe(false);

    // Restore by the backup's name, then start again.
    const restore = runTs("server/scripts/restore.ts", env, [name!]);
    expect((await restore.exited).code, restore.stderr()).toBe(0);
    expect(restore.stdout()).toContain("(database and uploads)");
    server = startServer({ ...env, PORT: String(await freePort()) });
    await waitUp(server);
    base = server.base;
    cookie = await signIn(base, "owner@demo.coatwright.test");

    const customerAfter = (await (await get(`/api/customers/${customer.id}`)).json()) as { name: string; email: string };
    expect(customerAfter).toMatchObject({ name: "Drill Customer Ostrander", email: "ostrander@example.test" });
    const jobAfter = (await (await get(`/api/jobs/${job.id}`)).json()) as { title: string };
    expect(jobAfter.title).toBe("Drill: tank in candy plum");
    expect(await jobCount()).toBe(jobsBefore);
    const photos = (await (await get(`/api/uploads?ownerType=job&ownerId=${job.id}`)).json()) as { id: number; caption: string }[];
    expect(photos.map((p) => [p.id, p.caption])).toEqual([[photo.id, "Before sanding"]]);
    const photoAfter = await get(`/api/uploads/${photo.id}`);
    expect(photoAfter.status).toBe(200);
    expect(Buffer.from(await photoAfter.arrayBuffer()).equals(photoBytes)).toBe(true);
    expect(Buffer.from(await (await get(`/api/uploads/${photo.id}/thumb`)).arrayBuffer()).equals(thumbBytes)).toBe(true);
    // The demo shop's own photos came back too (the seed puts some on its jobs and panels).
    expect(readdirSync(path.join(dataDir, "uploads")).length).toBeGreaterThan(2);

    server.proc.kill("SIGTERM");
    expect((await server.exited).code).toBe(0);
  }, 120_000);
});
