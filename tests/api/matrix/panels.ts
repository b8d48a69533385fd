import { asc } from "drizzle-orm";
import { office, signedIn, staff, type MatrixRows } from "./rows";
import { testPanels } from "../../../server/db/schema";
import { addPanel } from "../../support/booth-fixtures";
import type { Shop } from "../../support/test-app";

const panelIds = (s: Shop) => s.db.select({ id: testPanels.id }).from(testPanels).orderBy(asc(testPanels.id)).all().map((p) => p.id);
/** Two panels of one candy over one ground, the first made by the painter for job A. */
const twoPanels = (s: Shop) => {
  addPanel(s, { coats: 3, jobId: s.jobA.id, createdBy: s.painter.id, labL: 30, labA: 45, labB: 18 });
  addPanel(s, { coats: 4, labL: 27, labA: 43, labB: 15 });
};

export const rows: MatrixRows = {
  "GET /api/panels": { path: () => "/api/panels?candy=Candy%20garnet", prepare: twoPanels, expect: staff(200) },
  "GET /api/panels/compare": { path: (s) => `/api/panels/compare?ids=${panelIds(s).join(",")}`, prepare: twoPanels, expect: staff(200) },
  "GET /api/panels/ladder": { path: () => "/api/panels/ladder?ground=Fine%20silver&candy=Candy%20garnet", prepare: twoPanels, expect: staff(200) },
  "POST /api/panels": {
    path: () => "/api/panels",
    body: () => ({ groundName: "Gold flake", candyName: "Candy tangerine", letDownClear: 8, letDownToner: 1, coats: 5 }),
    expect: staff(201),
  },
  "GET /api/panels/:id": { path: (s) => `/api/panels/${panelIds(s)[0]}`, prepare: twoPanels, expect: staff(200) },
  "PATCH /api/panels/:id": { path: (s) => `/api/panels/${panelIds(s)[0]}`, prepare: twoPanels, body: () => ({ notes: "Sprayed at 22 °C", version: 1 }), expect: staff(200) },
  "DELETE /api/panels/:id": { path: (s) => `/api/panels/${panelIds(s)[1]}`, prepare: twoPanels, expect: office(204) },
  "GET /api/jobs/:id/colour": { path: (s) => `/api/jobs/${s.jobA.id}/colour`, prepare: twoPanels, expect: signedIn(200) },
  "PUT /api/jobs/:id/approved-panel": { path: (s) => `/api/jobs/${s.jobA.id}/approved-panel`, prepare: twoPanels, body: (s) => ({ panelId: panelIds(s)[0] }), expect: office(200) },
};
