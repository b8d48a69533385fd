import { Router } from "express";
import { z } from "zod";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { body, params, query } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import { approveQuoteInputSchema, declineQuoteInputSchema } from "../../../shared/schemas/quote.schema";
import { renderQuotePdf } from "../quotes/quote-pdf";
import { pdfDataFor, pdfFileName } from "../quotes/quote-sending";
import { offeredVersion } from "../quotes/quote-versions";
import {
  decideQuote,
  getPortalJob,
  getPortalQuote,
  listPortalJobs,
  listPortalQuotes,
  portalPhoto,
  portalSession,
} from "./portal.service";
import { portalViewer, viewerOf } from "./portal-viewer";
import { sendFile } from "../../http/send-file";

const photoQuerySchema = z.object({ size: z.enum(["thumb", "full"]).optional(), token: z.string().max(200).optional() });

/**
 * The customer portal's API. Each route is public at the guard because a visitor may hold a signed quote link
 * instead of a session; portalViewer() then lets in only a valid link or a signed-in customer (401 otherwise,
 * 403 for staff), and every query is scoped to that customer (and, with a link, to that one quote).
 */
export function portalRouter(deps: AppDeps) {
  const r = Router();
  const asViewer = portalViewer(deps);
  r.get("/session", allow("public"), asViewer, (req, res) => {
    res.json(portalSession(viewerOf(res)));
  });
  r.get("/quotes", allow("public"), asViewer, (req, res) => {
    res.json({ items: listPortalQuotes(deps, viewerOf(res)) });
  });
  r.get("/quotes/:id", allow("public"), asViewer, (req, res) => {
    const viewer = viewerOf(res);
    res.json(getPortalQuote(deps, viewer, params(req, idParamsSchema).id));
  });
  r.get("/quotes/:id/pdf", allow("public"), asViewer, async (req, res) => {
    const viewer = viewerOf(res);
    const id = params(req, idParamsSchema).id;
    getPortalQuote(deps, viewer, id);
    const v = offeredVersion(deps.db, id)!;
    const pdf = await renderQuotePdf(pdfDataFor(deps, v));
    sendFile(res, { data: pdf, mime: "application/pdf", name: pdfFileName(v), disposition: "inline", kept: "generated" });
  });
  r.post("/quotes/:id/approve", allow("public"), asViewer, (req, res) => {
    const viewer = viewerOf(res);
    const id = params(req, idParamsSchema).id;
    res.json(decideQuote(deps, viewer, id, "approved", body(req, approveQuoteInputSchema), req.ip ?? null));
  });
  r.post("/quotes/:id/decline", allow("public"), asViewer, (req, res) => {
    const viewer = viewerOf(res);
    const id = params(req, idParamsSchema).id;
    res.json(decideQuote(deps, viewer, id, "declined", body(req, declineQuoteInputSchema), req.ip ?? null));
  });
  r.get("/jobs", allow("public"), asViewer, (req, res) => {
    res.json({ items: listPortalJobs(deps, viewerOf(res)) });
  });
  r.get("/jobs/:id", allow("public"), asViewer, (req, res) => {
    const viewer = viewerOf(res);
    res.json(getPortalJob(deps, viewer, params(req, idParamsSchema).id));
  });
  r.get("/photos/:id", allow("public"), asViewer, (req, res) => {
    const viewer = viewerOf(res);
    const photo = portalPhoto(deps, viewer, params(req, idParamsSchema).id, query(req, photoQuerySchema).size === "thumb");
    res.type(photo.mime).setHeader("Cache-Control", "private, max-age=3600");
    res.send(photo.content);
  });
  return r;
}
