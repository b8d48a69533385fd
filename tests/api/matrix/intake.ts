import { customerOnly, office, type MatrixRows } from "./rows";
import { addPanel, addPhoto } from "../../support/booth-fixtures";
import { draftQuote } from "../../support/quotes";
import type { Shop } from "../../support/test-app";

const inspect = (s: Shop) => s.as("owner").put(`/api/jobs/${s.jobA.id}/inspection`).send({ version: 0, items: [{ itemId: s.itemA.id, existingFinish: "factory_finish", rust: "minor", solventTest: "unaffected" }] });

/** A panel of job A with its photo (panel 1). */
async function panelWithPhoto(s: Shop) {
  const p = addPanel(s, { jobId: s.jobA.id });
  await addPhoto(s, { ownerType: "panel", ownerId: p.id, jobId: s.jobA.id });
  return p;
}
/** Panel 1 sent to customer A, waiting for the answer. */
async function sentPanel(s: Shop) {
  const p = await panelWithPhoto(s);
  const res = await s.as("owner").post(`/api/panels/${p.id}/send-to-customer`).send({});
  if (res.status !== 200) throw new Error(`send panel: ${res.status} ${JSON.stringify(res.body)}`);
}

export const rows: MatrixRows = {
  "POST /api/panels/:id/send-to-customer": { path: () => "/api/panels/1/send-to-customer", prepare: panelWithPhoto, body: () => ({}), expect: office(200) },
  "GET /api/portal/jobs/:id/colour": { path: (s) => `/api/portal/jobs/${s.jobA.id}/colour`, prepare: sentPanel, expect: customerOnly(200) },
  "POST /api/portal/panels/:id/approve": { path: () => "/api/portal/panels/1/approve", prepare: sentPanel, body: () => ({ name: "Avery Stone" }), expect: customerOnly(200) },
  "GET /api/jobs/:id/inspection": { path: (s) => `/api/jobs/${s.jobA.id}/inspection`, prepare: inspect, expect: office(200) },
  "PUT /api/jobs/:id/inspection": {
    path: (s) => `/api/jobs/${s.jobA.id}/inspection`,
    body: (s) => ({ version: 0, items: [{ itemId: s.itemA.id, existingFinish: "primer", solventTest: "not_done" }] }),
    expect: office(200),
  },
  "POST /api/jobs/:id/inspection/prep-line": {
    path: (s) => `/api/jobs/${s.jobA.id}/inspection/prep-line`,
    prepare: async (s) => {
      await inspect(s);
      await draftQuote(s);
    },
    body: () => ({ quoteId: 1, editVersion: 2 }),
    expect: office(200),
  },
};
