import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { uploads } from "../../../server/db/schema";
import { customerOnly, type MatrixRows } from "./rows";
import { sentQuote } from "../../support/quotes";
import type { Shop } from "../../support/test-app";

/** A shareable photo of customer A's job, stored on disk like an upload. */
function sharedPhoto(s: Shop) {
  mkdirSync(s.app.deps.uploadsDir, { recursive: true });
  writeFileSync(path.join(s.app.deps.uploadsDir, "0123456789abcdef0123456789abcdef.jpg"), Buffer.from([0xff, 0xd8, 0xff, 0xd9]));
  return s.db
    .insert(uploads)
    .values({ ownerType: "job", ownerId: s.jobA.id, jobId: s.jobA.id, kind: "photo", mime: "image/jpeg", size: 4, originalName: "tank.jpg", storedName: "0123456789abcdef0123456789abcdef.jpg", shareable: true })
    .returning()
    .get();
}

// Public at the guard (a quote link stands in for a session), but without a link: anonymous 401, staff 403.
export const rows: MatrixRows = {
  "GET /api/portal/session": { path: () => "/api/portal/session", expect: customerOnly(200) },
  "GET /api/portal/quotes": { prepare: (s) => sentQuote(s), path: () => "/api/portal/quotes", expect: customerOnly(200) },
  "GET /api/portal/quotes/:id": { prepare: (s) => sentQuote(s), path: () => "/api/portal/quotes/1", expect: customerOnly(200) },
  "GET /api/portal/quotes/:id/pdf": { prepare: (s) => sentQuote(s), path: () => "/api/portal/quotes/1/pdf", expect: customerOnly(200) },
  "POST /api/portal/quotes/:id/approve": { prepare: (s) => sentQuote(s), path: () => "/api/portal/quotes/1/approve", body: () => ({ name: "Avery Stone" }), expect: customerOnly(200) },
  "POST /api/portal/quotes/:id/decline": { prepare: (s) => sentQuote(s), path: () => "/api/portal/quotes/1/decline", body: () => ({ reason: "Too dear" }), expect: customerOnly(200) },
  "GET /api/portal/jobs": { path: () => "/api/portal/jobs", expect: customerOnly(200) },
  "GET /api/portal/jobs/:id": { path: (s) => `/api/portal/jobs/${s.jobA.id}`, expect: customerOnly(200) },
  "GET /api/portal/photos/:id": { prepare: sharedPhoto, path: () => "/api/portal/photos/1", expect: customerOnly(200) },
};
