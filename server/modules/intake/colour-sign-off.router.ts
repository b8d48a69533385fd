import { Router } from "express";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { ctxOf } from "../../http/context";
import { body, params } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import { sendPanelsInputSchema } from "../../../shared/schemas/colour-sign-off.schema";
import { approveQuoteInputSchema } from "../../../shared/schemas/quote.schema";
import { portalViewer, viewerOf } from "../portal/portal-viewer";
import { approvePanel, portalColour, sendPanelsToCustomer } from "./colour-sign-off.service";

/** The office sends test panels to the customer (under /api/panels). */
export function panelSendRouter(deps: AppDeps) {
  const r = Router();
  r.post("/:id/send-to-customer", allow("office"), async (req, res) => {
    res.json(await sendPanelsToCustomer(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, sendPanelsInputSchema)));
  });
  return r;
}

/**
 * The customer's side (under /api/portal): public at the guard like the rest of the portal, since a quote link
 * stands in for a session; portalViewer() lets in only a valid link or a signed-in customer, scoped to their jobs.
 */
export function portalColourRouter(deps: AppDeps) {
  const r = Router();
  const asViewer = portalViewer(deps);
  r.get("/jobs/:id/colour", allow("public"), asViewer, (req, res) => {
    const viewer = viewerOf(res);
    res.json(portalColour(deps, viewer, params(req, idParamsSchema).id));
  });
  r.post("/panels/:id/approve", allow("public"), asViewer, (req, res) => {
    const viewer = viewerOf(res);
    res.json(approvePanel(deps, viewer, params(req, idParamsSchema).id, body(req, approveQuoteInputSchema), req.ip ?? null));
  });
  return r;
}
