import { office, ownerOnly, staff, type MatrixRows } from "./rows";
import { addBooths, bookedShop, MONDAY_8, HOUR } from "../../support/schedule-fixtures";
import { scheduleSessions, booths } from "../../../server/db/schema";
import type { Shop } from "../../support/test-app";

const boothId = (s: Shop) => s.db.select({ id: booths.id }).from(booths).get()!.id;
const sessionId = (s: Shop) => s.db.select({ id: scheduleSessions.id }).from(scheduleSessions).get()!.id;
const iso = (ms: number) => new Date(ms).toISOString();

export const rows: MatrixRows = {
  "GET /api/booths": { prepare: addBooths, path: () => "/api/booths", expect: staff(200) },
  "POST /api/booths": { path: () => "/api/booths", body: () => ({ name: "Booth 3", timeZone: "UTC" }), expect: ownerOnly(201) },
  "PATCH /api/booths/:id": { prepare: addBooths, path: (s) => `/api/booths/${boothId(s)}`, body: () => ({ closesAt: "18:00", version: 1 }), expect: ownerOnly(200) },
  "GET /api/schedule": { prepare: bookedShop, path: () => `/api/schedule?from=${iso(MONDAY_8 - 8 * HOUR)}&to=${iso(MONDAY_8 + 7 * 24 * HOUR)}`, expect: staff(200) },
  "GET /api/schedule/jobs": { prepare: bookedShop, path: () => "/api/schedule/jobs", expect: office(200) },
  "PUT /api/schedule/jobs/:jobId/prep": { prepare: bookedShop, path: (s) => `/api/schedule/jobs/${s.jobA.id}/prep`, body: () => ({ readyAt: iso(MONDAY_8 - HOUR) }), expect: office(200) },
  "POST /api/schedule/sessions": {
    prepare: (s) => {
      const b = bookedShop(s);
      (s as Shop & { layerId?: number }).layerId = b.plan.layers[1]!.id;
    },
    path: () => "/api/schedule/sessions",
    body: (s) => ({ boothId: boothId(s), jobId: s.jobA.id, layerId: (s as Shop & { layerId?: number }).layerId, startsAt: iso(MONDAY_8 + 4 * HOUR) }),
    expect: office(201),
  },
  "PATCH /api/schedule/sessions/:id": { prepare: bookedShop, path: (s) => `/api/schedule/sessions/${sessionId(s)}`, body: () => ({ startsAt: iso(MONDAY_8 + HOUR), version: 1 }), expect: office(200) },
  "DELETE /api/schedule/sessions/:id": { prepare: bookedShop, path: (s) => `/api/schedule/sessions/${sessionId(s)}`, expect: office(204) },
  "POST /api/schedule/suggest": { prepare: bookedShop, path: () => "/api/schedule/suggest", body: () => ({ from: iso(MONDAY_8) }), expect: office(200) },
  "POST /api/schedule/accept": { prepare: bookedShop, path: () => "/api/schedule/accept", body: () => ({ from: iso(MONDAY_8), sessions: [] }), expect: office(200) },
};
