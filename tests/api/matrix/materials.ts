import { office, staff, type MatrixRows } from "./rows";
import { fx, TINY_PDF } from "../../support/finish-fixtures";
import { storeFile } from "../../../server/modules/uploads/storage";
import { addFile } from "../../../server/modules/materials/material-files.service";
import type { Shop } from "../../support/test-app";

/** Stores a safety data sheet on the clear, for the file read/delete rows. */
async function withFile(s: Shop) {
  const f = fx(s);
  const stored = await storeFile(s.app.deps.uploadsDir, { buffer: TINY_PDF, size: TINY_PDF.length, originalname: "clear-sds.pdf" } as Express.Multer.File, "document");
  const actor = { id: s.owner.id, email: s.owner.email, name: "Owner", role: "owner" as const, customerId: null };
  (s as Shop & { fileId?: number }).fileId = addFile(s.app.deps, actor, f.clear.id, "sds", stored).id;
}
const fileId = (s: Shop) => (s as Shop & { fileId?: number }).fileId;

const newMaterial = () => ({ code: "S9-B12", name: "Test sealer, grey", category: "sealer", purchaseUnit: "quart", costCents: 5400, volumeSolidsPct: 48 });

export const rows: MatrixRows = {
  "GET /api/materials": { prepare: fx, path: () => "/api/materials", expect: staff(200) },
  "GET /api/materials/low-stock": { prepare: fx, path: () => "/api/materials/low-stock", expect: staff(200) },
  "POST /api/materials": { path: () => "/api/materials", body: newMaterial, expect: office(201) },
  "GET /api/materials/:id": { prepare: fx, path: (s) => `/api/materials/${fx(s).clear.id}`, expect: staff(200) },
  "PATCH /api/materials/:id": { prepare: fx, path: (s) => `/api/materials/${fx(s).clear.id}`, body: () => ({ costCents: 9900, version: 1 }), expect: office(200) },
  "DELETE /api/materials/:id": { prepare: fx, path: (s) => `/api/materials/${fx(s).spare.id}`, expect: office(204) },
  "GET /api/materials/:id/lots": { prepare: fx, path: (s) => `/api/materials/${fx(s).clear.id}/lots`, expect: staff(200) },
  "POST /api/materials/:id/lots": {
    prepare: fx,
    path: (s) => `/api/materials/${fx(s).clear.id}/lots`,
    body: () => ({ lotNumber: "CL-B2", quantityOnHand: 4, receivedOn: "2026-11-02", expiresOn: "2028-11-02" }),
    expect: office(201),
  },
  "PATCH /api/materials/:id/lots/:lotId": {
    prepare: fx,
    path: (s) => `/api/materials/${fx(s).clear.id}/lots/${fx(s).clearLot.id}`,
    body: () => ({ quantityOnHand: 1.5, version: 1 }),
    expect: office(200),
  },
  "DELETE /api/materials/:id/lots/:lotId": { prepare: fx, path: (s) => `/api/materials/${fx(s).clear.id}/lots/${fx(s).clearLot.id}`, expect: office(204) },
  "GET /api/materials/:id/files": { prepare: withFile, path: (s) => `/api/materials/${fx(s).clear.id}/files`, expect: staff(200) },
  "POST /api/materials/:id/files": {
    prepare: fx,
    path: (s) => `/api/materials/${fx(s).clear.id}/files`,
    attach: () => ({ data: TINY_PDF, filename: "clear-tds.pdf", fields: { kind: "tds" } }),
    expect: office(201),
  },
  "GET /api/materials/:id/files/:fileId": { prepare: withFile, path: (s) => `/api/materials/${fx(s).clear.id}/files/${fileId(s)}`, expect: staff(200) },
  "DELETE /api/materials/:id/files/:fileId": { prepare: withFile, path: (s) => `/api/materials/${fx(s).clear.id}/files/${fileId(s)}`, expect: office(204) },
};
