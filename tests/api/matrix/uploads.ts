import { asc } from "drizzle-orm";
import { signedIn, staff, type MatrixRows } from "./rows";
import { uploads } from "../../../server/db/schema";
import { addPhoto, swatchPng } from "../../support/booth-fixtures";
import type { Shop } from "../../support/test-app";

let png: Buffer;
const photoId = (s: Shop) => s.db.select({ id: uploads.id }).from(uploads).orderBy(asc(uploads.id)).get()!.id;
/** A shareable photo on job A (the first painter's job, customer A's), uploaded by that painter. */
const sharedPhoto = (s: Shop) => addPhoto(s, { ownerType: "job", ownerId: s.jobA.id, jobId: s.jobA.id }, { shareable: true, by: s.painter.id });

export const rows: MatrixRows = {
  "POST /api/uploads": {
    path: () => "/api/uploads",
    prepare: async () => {
      png ??= await swatchPng();
    },
    attach: (s) => ({ data: png, filename: "swatch.png", fields: { ownerType: "job", ownerId: String(s.jobA.id) } }),
    expect: staff(201),
  },
  "GET /api/uploads": { path: (s) => `/api/uploads?jobId=${s.jobA.id}`, prepare: sharedPhoto, expect: signedIn(200) },
  "GET /api/uploads/:id": { path: (s) => `/api/uploads/${photoId(s)}`, prepare: sharedPhoto, expect: signedIn(200) },
  "GET /api/uploads/:id/thumb": { path: (s) => `/api/uploads/${photoId(s)}/thumb`, prepare: sharedPhoto, expect: signedIn(200) },
  "PATCH /api/uploads/:id": { path: (s) => `/api/uploads/${photoId(s)}`, prepare: sharedPhoto, body: () => ({ shareable: false, version: 1 }), expect: staff(200) },
  "DELETE /api/uploads/:id": { path: (s) => `/api/uploads/${photoId(s)}`, prepare: sharedPhoto, expect: staff(204) },
};
