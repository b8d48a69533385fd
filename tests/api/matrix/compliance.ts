import { office, type MatrixRows } from "./rows";

export const rows: MatrixRows = {
  "GET /api/compliance": { path: () => "/api/compliance?from=2026-01-01&to=2026-12-31", expect: office(200) },
  "GET /api/compliance/export.csv": { path: () => "/api/compliance/export.csv?from=2026-01-01&to=2026-12-31", expect: office(200) },
};
