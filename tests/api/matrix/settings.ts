import { office, ownerOnly, signedIn, type MatrixRows } from "./rows";

export const rows: MatrixRows = {
  "GET /api/settings/shop": { path: () => "/api/settings/shop", expect: signedIn(200) },
  "GET /api/settings": { path: () => "/api/settings", expect: office(200) },
  "PATCH /api/settings": { path: () => "/api/settings", body: () => ({ taxPercent: 6.5, version: 1 }), expect: ownerOnly(200) },
};
