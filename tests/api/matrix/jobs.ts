import { office, signedIn, staff, type MatrixRows } from "./rows";
import type { Shop } from "../../support/test-app";

const newJob = (s: Shop) => ({ customerId: s.customerA.id, title: "Hood scoop in candy red" });
const newItem = () => ({ name: "Mirror cap", substrate: "carbon_fiber", surfaceArea: 0.1, areaUnit: "m2" });

export const rows: MatrixRows = {
  "GET /api/jobs": { path: () => "/api/jobs", expect: signedIn(200) },
  "GET /api/jobs/board": { path: () => "/api/jobs/board", expect: staff(200) },
  "POST /api/jobs": { path: () => "/api/jobs", body: newJob, expect: office(201) },
  "GET /api/jobs/:id": { path: (s) => `/api/jobs/${s.jobA.id}`, expect: signedIn(200) },
  "PATCH /api/jobs/:id": { path: (s) => `/api/jobs/${s.jobA.id}`, body: () => ({ title: "Helmet in candy teal, gold leaf", version: 1 }), expect: office(200) },
  "DELETE /api/jobs/:id": { path: (s) => `/api/jobs/${s.inquiryA.id}`, expect: office(204) },
  "POST /api/jobs/:id/stage": { path: (s) => `/api/jobs/${s.jobA.id}/stage`, body: () => ({ stage: "in_booth" }), expect: staff(200) },
  "GET /api/jobs/:id/items": { path: (s) => `/api/jobs/${s.jobA.id}/items`, expect: signedIn(200) },
  "POST /api/jobs/:id/items": { path: (s) => `/api/jobs/${s.jobA.id}/items`, body: newItem, expect: office(201) },
  "GET /api/jobs/:id/items/:itemId": { path: (s) => `/api/jobs/${s.jobA.id}/items/${s.itemA.id}`, expect: signedIn(200) },
  "PATCH /api/jobs/:id/items/:itemId": {
    path: (s) => `/api/jobs/${s.jobA.id}/items/${s.itemA.id}`,
    body: () => ({ surfaceArea: 0.4, version: 1 }),
    expect: office(200),
  },
  "DELETE /api/jobs/:id/items/:itemId": { path: (s) => `/api/jobs/${s.jobA.id}/items/${s.itemA.id}`, expect: office(204) },
};
