import { eq } from "drizzle-orm";
import { jobs } from "../../../server/db/schema";
import { office, type MatrixRows } from "./rows";
import { draftQuote, sentQuote } from "../../support/quotes";
import { finishFixtures } from "../../support/finish-fixtures";

// Each row runs on a fresh shop, so the first quote made in `prepare` is quote 1.
export const rows: MatrixRows = {
  "GET /api/quotes": { path: () => "/api/quotes", expect: office(200) },
  "POST /api/quotes": { path: () => "/api/quotes", body: (s) => ({ jobId: s.jobA.id }), expect: office(201) },
  "GET /api/quotes/:id": { prepare: (s) => draftQuote(s), path: () => "/api/quotes/1", expect: office(200) },
  "PATCH /api/quotes/:id": { prepare: (s) => draftQuote(s), path: () => "/api/quotes/1", body: () => ({ intro: "Thanks for asking us.", editVersion: 2 }), expect: office(200) },
  "DELETE /api/quotes/:id": { prepare: (s) => draftQuote(s), path: () => "/api/quotes/1", expect: office(200) },
  "POST /api/quotes/:id/versions": { prepare: (s) => sentQuote(s), path: () => "/api/quotes/1/versions", expect: office(201) },
  "GET /api/quotes/:id/versions/:version": { prepare: (s) => draftQuote(s), path: () => "/api/quotes/1/versions/1", expect: office(200) },
  "POST /api/quotes/:id/fill-materials": {
    prepare: (s) => {
      finishFixtures(s); // a catalogue and a finish plan for job A
      return draftQuote(s);
    },
    path: () => "/api/quotes/1/fill-materials",
    expect: office(200),
  },
  "GET /api/quotes/:id/pdf": { prepare: (s) => draftQuote(s), path: () => "/api/quotes/1/pdf", expect: office(200) },
  "POST /api/quotes/:id/send": { prepare: (s) => draftQuote(s), path: () => "/api/quotes/1/send", body: () => ({}), expect: office(200) },
  "GET /api/messages": { path: (s) => `/api/messages?jobId=${s.jobA.id}`, expect: office(200) },
  "POST /api/messages/ready-notice": {
    prepare: (s) => s.db.update(jobs).set({ stage: "ready" }).where(eq(jobs.id, s.jobA.id)).run(),
    path: () => "/api/messages/ready-notice",
    body: (s) => ({ jobId: s.jobA.id }),
    expect: office(201),
  },
};
