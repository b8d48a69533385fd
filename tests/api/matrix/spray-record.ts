import { office, signedIn, staff, type MatrixRows } from "./rows";
import { guns } from "../../../server/db/schema";
import { addBoothPlan, addCoat, addPanel } from "../../support/booth-fixtures";
import type { Shop } from "../../support/test-app";

const gunId = (s: Shop) => s.db.select({ id: guns.id }).from(guns).get()!.id;
const withGun = (s: Shop) => s.db.insert(guns).values({ name: "Gun 3 (clear)" }).run();

/** Job A's plan with one candy coat logged, and a panel linked to that layer. */
function sprayed(s: Shop) {
  const plan = addBoothPlan(s, s.jobA.id);
  addCoat(s, s.jobA.id, plan.version.id, plan.layers[0]!.id, 1, Date.now(), s.painter.id);
  const panel = addPanel(s, { jobId: s.jobA.id, planLayerId: plan.layers[1]!.id });
  (s as Shop & { panelId?: number }).panelId = panel.id;
}
const panelId = (s: Shop) => (s as Shop & { panelId?: number }).panelId;

export const rows: MatrixRows = {
  "GET /api/guns": { prepare: withGun, path: () => "/api/guns", expect: staff(200) },
  "POST /api/guns": { path: () => "/api/guns", body: () => ({ name: "Gun 4 (pearl)", description: "HVLP, 1.4 mm" }), expect: office(201) },
  "PATCH /api/guns/:id": { prepare: withGun, path: (s) => `/api/guns/${gunId(s)}`, body: () => ({ active: false, version: 1 }), expect: office(200) },
  // Job A is the painter's and customer A's own.
  "GET /api/jobs/:id/finish-record": { prepare: sprayed, path: (s) => `/api/jobs/${s.jobA.id}/finish-record`, expect: signedIn(200) },
  "GET /api/jobs/:id/finish-record.pdf": { prepare: sprayed, path: (s) => `/api/jobs/${s.jobA.id}/finish-record.pdf`, expect: signedIn(200) },
  "POST /api/jobs/:id/repeat": { prepare: sprayed, path: (s) => `/api/jobs/${s.jobA.id}/repeat`, body: () => ({}), expect: office(201) },
  "POST /api/panels/:id/repeat": { prepare: sprayed, path: (s) => `/api/panels/${panelId(s)}/repeat`, body: () => ({}), expect: office(201) },
};
