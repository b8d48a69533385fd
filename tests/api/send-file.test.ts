import { describe, expect, it } from "vitest";
import { parse } from "content-disposition";
import { makeShop } from "../support/test-app";
import { finishFixtures, TINY_PDF } from "../support/finish-fixtures";

describe("files and documents sent by the API", () => {
  it("a stored document opens in the browser under its own name, as it was stored, and may be kept for an hour", async () => {
    const s = await makeShop();
    const f = finishFixtures(s);
    // An en dash, an accent and double quotes: a name as people type it.
    const name = 'Klar "Hoch" – Sicherheitsdatenblatt é.pdf';
    const up = await s.as("owner").post(`/api/materials/${f.clear.id}/files`).field("kind", "sds").attach("file", TINY_PDF, name);
    expect(up.status).toBe(201);
    const dl = await s.as("painter").get(`/api/materials/${f.clear.id}/files/${up.body.id}`).buffer(true);
    expect(dl.status).toBe(200);
    // Read back with the same library browsers' rules are written in (RFC 6266 / RFC 8187): the stored name exactly.
    const disposition = parse(dl.headers["content-disposition"] as string);
    expect(disposition.type).toBe("inline");
    expect(up.body.originalName).toMatch(/^Klar .*\.pdf$/);
    expect(disposition.parameters.filename).toBe(up.body.originalName);
    expect(dl.headers["cache-control"]).toBe("private, max-age=3600");
    expect(Buffer.compare(dl.body as Buffer, TINY_PDF)).toBe(0);
  });

  it("a generated export downloads as an attachment and is never kept (it is made from records that change)", async () => {
    const s = await makeShop();
    const csv = await s.as("owner").get("/api/compliance/export.csv?from=2026-11-01&to=2026-11-30");
    expect(csv.status).toBe(200);
    expect(parse(csv.headers["content-disposition"] as string)).toEqual({ type: "attachment", parameters: { filename: "voc-log-2026-11-01-to-2026-11-30.csv" } });
    expect(csv.headers["cache-control"]).toBe("no-store");
    expect(csv.headers["content-type"]).toMatch(/^text\/csv/);
  });
});
