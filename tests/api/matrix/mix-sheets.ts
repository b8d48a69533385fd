import { staff, type MatrixRows } from "./rows";
import { fx } from "../../support/finish-fixtures";

export const rows: MatrixRows = {
  "GET /api/mix-sheets": { prepare: fx, path: () => "/api/mix-sheets", expect: staff(200) },
  // Job A is assigned to the signed-in painter, who may make and record its batches.
  "POST /api/mix-sheets": {
    prepare: fx,
    path: () => "/api/mix-sheets",
    body: (s) => ({ jobId: s.jobA.id, layerId: fx(s).layer.id, mode: "total", amount: 12, unit: "floz", weigh: true, roundingStep: 1, roundingUnit: "g" }),
    expect: staff(201),
  },
  "GET /api/mix-sheets/:id": { prepare: fx, path: (s) => `/api/mix-sheets/${fx(s).sheet.id}`, expect: staff(200) },
  "DELETE /api/mix-sheets/:id": { prepare: fx, path: (s) => `/api/mix-sheets/${fx(s).sheet.id}`, expect: staff(204) },
  "POST /api/mix-sheets/:id/record": { prepare: fx, path: (s) => `/api/mix-sheets/${fx(s).sheet.id}/record`, body: () => ({ lines: [] }), expect: staff(200) },
  "POST /api/mix-sheets/:id/void": { prepare: fx, path: (s) => `/api/mix-sheets/${fx(s).sheet.id}/void`, body: () => ({ reason: "Mixed for the wrong layer" }), expect: staff(200) },
};
