import { staff, type MatrixRows } from "./rows";
import { coatLogs } from "../../../server/db/schema";
import { addCoat, readyForBooth } from "../../support/booth-fixtures";
import type { Shop } from "../../support/test-app";

/** Job A with a plan, signed-off prep and one coat already logged. */
const oneCoat = (s: Shop) => {
  const plan = readyForBooth(s);
  addCoat(s, s.jobA.id, plan.version.id, plan.layers[0]!.id, 1, Date.now() - 60_000, s.painter.id);
  return plan;
};
const layerOf = (s: Shop) => (s as Shop & { boothPlan?: ReturnType<typeof readyForBooth> }).boothPlan!;
/** Painters on their own jobs and the owner log coats; estimators read the card only. */
const loggers = { anonymous: 401, owner: 201, estimator: 403, painter: 201, customer: 403 };

export const rows: MatrixRows = {
  "GET /api/jobs/:id/booth": { path: (s) => `/api/jobs/${s.jobA.id}/booth`, prepare: oneCoat, expect: staff(200) },
  "GET /api/jobs/:id/ticket": { path: (s) => `/api/jobs/${s.jobA.id}/ticket`, prepare: oneCoat, expect: staff(200) },
  "GET /api/coat-logs": { path: (s) => `/api/coat-logs?jobId=${s.jobA.id}`, prepare: oneCoat, expect: staff(200) },
  "POST /api/coat-logs": {
    path: () => "/api/coat-logs",
    prepare: (s) => Object.assign(s, { boothPlan: readyForBooth(s) }),
    body: (s) => ({ jobId: s.jobA.id, layerId: layerOf(s).layers[0]!.id, coatNumber: 1, boothTemp: 21, tempUnit: "C", humidityPct: 48 }),
    expect: loggers,
  },
  "POST /api/coat-logs/:id/corrections": {
    path: (s) => `/api/coat-logs/${s.db.select({ id: coatLogs.id }).from(coatLogs).get()!.id}/corrections`,
    prepare: oneCoat,
    body: () => ({ reason: "Thermometer read in the wrong unit", boothTemp: 70, tempUnit: "F" }),
    expect: loggers,
  },
};
