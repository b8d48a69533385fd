import { office, type MatrixRows } from "./rows";

export const rows: MatrixRows = {
  "GET /api/dashboard": { path: () => "/api/dashboard", expect: office(200) },
};
