import { Router } from "express";
import type { AppDeps } from "../../deps";
import { actorOf, allow } from "../../http/guard";
import { ctxOf } from "../../http/context";
import { body, params } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import { approveQuoteInputSchema, declineQuoteInputSchema } from "../../../shared/schemas/quote.schema";
import { createChangeOrderInputSchema, sendChangeOrderInputSchema, updateChangeOrderInputSchema } from "../../../shared/schemas/change-order.schema";
import { portalViewer, viewerOf } from "../portal/portal-viewer";
import { createChangeOrder, getChangeOrder, listJobChangeOrders, sendChangeOrder, updateChangeOrder } from "./change-orders.service";
import { createChangeOrderCheckout, decideChangeOrder, getPortalChangeOrder, listPortalChangeOrders } from "./change-order-portal";

/** A job's change orders (under /api/jobs): staff read (painters without money), the office opens them. */
export function jobChangeOrdersRouter(deps: AppDeps) {
  const r = Router();
  r.get("/:id/change-orders", allow("staff"), (req, res) => {
    res.json(listJobChangeOrders(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.post("/:id/change-orders", allow("office"), (req, res) => {
    res.status(201).json(createChangeOrder(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, createChangeOrderInputSchema)));
  });
  return r;
}

/** One change order (under /api/change-orders). */
export function changeOrdersRouter(deps: AppDeps) {
  const r = Router();
  r.get("/:id", allow("staff"), (req, res) => {
    res.json(getChangeOrder(deps, actorOf(res), params(req, idParamsSchema).id));
  });
  r.patch("/:id", allow("office"), (req, res) => {
    res.json(updateChangeOrder(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, updateChangeOrderInputSchema)));
  });
  r.post("/:id/send", allow("office"), async (req, res) => {
    res.json(await sendChangeOrder(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, sendChangeOrderInputSchema)));
  });
  return r;
}

/**
 * The customer's side (under /api/portal): public at the guard like the rest of the portal, since a quote link
 * stands in for a session; portalViewer() lets in only a valid link or a signed-in customer, scoped to their jobs.
 */
export function portalChangeOrdersRouter(deps: AppDeps) {
  const r = Router();
  const asViewer = portalViewer(deps);
  r.get("/jobs/:id/change-orders", allow("public"), asViewer, (req, res) => {
    res.json(listPortalChangeOrders(deps, viewerOf(res), params(req, idParamsSchema).id));
  });
  r.get("/change-orders/:id", allow("public"), asViewer, (req, res) => {
    res.json(getPortalChangeOrder(deps, viewerOf(res), params(req, idParamsSchema).id));
  });
  r.post("/change-orders/:id/approve", allow("public"), asViewer, (req, res) => {
    const viewer = viewerOf(res);
    res.json(decideChangeOrder(deps, viewer, params(req, idParamsSchema).id, "approved", body(req, approveQuoteInputSchema), req.ip ?? null));
  });
  r.post("/change-orders/:id/decline", allow("public"), asViewer, (req, res) => {
    const viewer = viewerOf(res);
    res.json(decideChangeOrder(deps, viewer, params(req, idParamsSchema).id, "declined", body(req, declineQuoteInputSchema), req.ip ?? null));
  });
  r.post("/change-orders/:id/checkout", allow("public"), asViewer, async (req, res) => {
    const viewer = viewerOf(res);
    res.status(201).json(await createChangeOrderCheckout(deps, viewer, params(req, idParamsSchema).id));
  });
  return r;
}
