import { office, staff, type MatrixRows } from "./rows";
import { fx } from "../../support/finish-fixtures";
import type { Shop } from "../../support/test-app";

const doc = (s: Shop) => ({
  version: 1,
  name: "Test solid colour",
  layers: [
    {
      kind: "clear",
      name: "Clear",
      coats: 2,
      flashMinutes: 10,
      dryMinutes: 60,
      dryFilmPerCoat: 50,
      components: [
        { materialId: fx(s).clear.id, label: "clear", parts: 4 },
        { materialId: fx(s).hardener.id, label: "hardener", parts: 1 },
      ],
    },
  ],
});

export const rows: MatrixRows = {
  "GET /api/plans": { prepare: fx, path: () => "/api/plans", expect: staff(200) },
  "POST /api/plans": { prepare: fx, path: () => "/api/plans", body: doc, expect: office(201) },
  "GET /api/plans/:id": { prepare: fx, path: (s) => `/api/plans/${fx(s).template.id}`, expect: staff(200) },
  "PUT /api/plans/:id": { prepare: fx, path: (s) => `/api/plans/${fx(s).template.id}`, body: doc, expect: office(200) },
  "DELETE /api/plans/:id": { prepare: fx, path: (s) => `/api/plans/${fx(s).template.id}`, expect: office(204) },
  "POST /api/plans/:id/copy-as-template": { prepare: fx, path: (s) => `/api/plans/${fx(s).jobPlan.id}/copy-as-template`, body: () => ({ name: "Helmet teal" }), expect: office(201) },
  // Job A is the signed-in painter's job, so the painter reads its plan.
  "GET /api/plans/:id/versions": { prepare: fx, path: (s) => `/api/plans/${fx(s).jobPlan.id}/versions`, expect: staff(200) },
  "GET /api/plans/:id/versions/:versionId": {
    prepare: fx,
    path: (s) => `/api/plans/${fx(s).jobPlan.id}/versions/${fx(s).jobPlan.latest.id}`,
    expect: staff(200),
  },
  "GET /api/jobs/:id/plan": { prepare: fx, path: (s) => `/api/jobs/${s.jobA.id}/plan`, expect: staff(200) },
  "POST /api/jobs/:id/plan": { prepare: fx, path: (s) => `/api/jobs/${s.jobB.id}/plan`, body: (s) => ({ fromPlanId: fx(s).template.id }), expect: office(201) },
};
