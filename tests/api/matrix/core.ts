import { all, ownerOnly, type MatrixRows } from "./rows";


export const rows: MatrixRows = {
  "GET /api/health": { path: () => "/api/health", expect: all(200) },
  "GET /api/outbox": { path: () => "/api/outbox", expect: ownerOnly(200) },
  "GET /api/outbox/:id/attachments/:index": { path: () => "/api/outbox/none-here/attachments/0", expect: ownerOnly(404) },
};
