import { office, staff, type MatrixRows } from "./rows";
import { prepRecords } from "../../../server/db/schema";
import { signOffPrep } from "../../support/booth-fixtures";
import type { Shop } from "../../support/test-app";

const recordId = (s: Shop) => s.db.select({ id: prepRecords.id }).from(prepRecords).get()!.id;
/** A prep record on job A with every step a steel item needs, not yet signed off. */
const openRecord = (s: Shop) =>
  s.db
    .insert(prepRecords)
    .values({ jobId: s.jobA.id, itemId: s.itemA.id, substrate: "steel", scuffMedium: "scuff_pad", cleaner: "Wax and grease remover", tackCloth: true, preparedBy: s.painter.id, preparedAt: Date.now() })
    .run();

export const rows: MatrixRows = {
  "GET /api/prep-records": { path: (s) => `/api/prep-records?jobId=${s.jobA.id}`, expect: staff(200) },
  "POST /api/prep-records": { path: () => "/api/prep-records", body: (s) => ({ itemId: s.itemA.id, scuffMedium: "scuff_pad", scuffGrit: 600 }), expect: staff(201) },
  "GET /api/prep-records/:id": { path: (s) => `/api/prep-records/${recordId(s)}`, prepare: openRecord, expect: staff(200) },
  "PATCH /api/prep-records/:id": { path: (s) => `/api/prep-records/${recordId(s)}`, prepare: openRecord, body: () => ({ scuffGrit: 800, version: 1 }), expect: staff(200) },
  "POST /api/prep-records/:id/sign-off": { path: (s) => `/api/prep-records/${recordId(s)}/sign-off`, prepare: openRecord, expect: staff(200) },
  "POST /api/prep-records/:id/reopen": {
    path: (s) => `/api/prep-records/${recordId(s)}/reopen`,
    prepare: (s) => signOffPrep(s, s.jobA.id, s.itemA.id, s.painter.id),
    body: () => ({ reason: "Customer found a chip after sign-off" }),
    expect: office(200),
  },
};
