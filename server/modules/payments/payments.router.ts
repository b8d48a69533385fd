import { Router } from "express";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { ctxOf } from "../../http/context";
import { rawBodyOf } from "../../http/raw-body";
import { body, params, query } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import { acceptPaymentInputSchema, checkoutInputSchema, listPaymentsQuerySchema, refundInputSchema } from "../../../shared/schemas/payment.schema";
import { portalViewer, viewerOf } from "../portal/portal-viewer";
import { acceptPayment, handleWebhook, listPayments, requestRefund } from "./payments.service";
import { createCheckout } from "./checkout.service";

export function paymentsRouter(deps: AppDeps) {
  const r = Router();
  const asViewer = portalViewer(deps);
  // The customer (signed in, or holding the quote link) starts paying the deposit; see portalViewer.
  r.post("/checkout", allow("public"), asViewer, async (req, res) => {
    const viewer = viewerOf(res);
    res.status(201).json(await createCheckout(deps, viewer, body(req, checkoutInputSchema).quoteId));
  });
  // The provider's webhook: no session, trusted only through its signature over the raw body.
  r.post("/webhook", allow("public"), async (req, res) => {
    res.json(await handleWebhook(deps, rawBodyOf(req), req.get("stripe-signature")));
  });
  r.get("/", allow("office"), (req, res) => {
    res.json(listPayments(deps, query(req, listPaymentsQuerySchema)));
  });
  r.post("/:id/refund", allow("owner"), async (req, res) => {
    res.status(202).json(await requestRefund(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, refundInputSchema)));
  });
  r.post("/:id/accept", allow("owner"), (req, res) => {
    res.json(acceptPayment(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, acceptPaymentInputSchema).note));
  });
  return r;
}
