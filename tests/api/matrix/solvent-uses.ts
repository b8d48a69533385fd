import { staff, type MatrixRows } from "./rows";
import { addMaterial } from "../../support/finish-fixtures";
import type { Shop } from "../../support/test-app";

const gunWash = (s: Shop) => Object.assign(s, { gunWash: addMaterial(s, { code: "S9-B06", name: "Test gun wash", category: "cleaner", purchaseUnit: "gallon", costCents: 1000, vocGPerL: 880 }) });

export const rows: MatrixRows = {
  "GET /api/solvent-uses": { path: () => "/api/solvent-uses?from=2026-01-01&to=2026-12-31", expect: staff(200) },
  "POST /api/solvent-uses": {
    path: () => "/api/solvent-uses",
    prepare: gunWash,
    body: (s) => ({ materialId: (s as Shop & { gunWash: { id: number } }).gunWash.id, purpose: "gun_cleaning", amount: 250, unit: "mL" }),
    expect: staff(201),
  },
};
