import { ownerOnly, type MatrixRows } from "./rows";

export const rows: MatrixRows = {
  "GET /api/audit": { path: () => "/api/audit?kind=user", expect: ownerOnly(200) },
};
