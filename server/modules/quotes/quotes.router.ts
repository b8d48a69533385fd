import { Router } from "express";
import type { AppDeps } from "../../deps";
import { allow } from "../../http/guard";
import { ctxOf } from "../../http/context";
import { body, params, query } from "../../http/validate";
import { idParamsSchema } from "../../../shared/schemas/common.schema";
import {
  createQuoteInputSchema,
  listQuotesQuerySchema,
  quotePdfQuerySchema,
  quoteVersionParamsSchema,
  sendQuoteInputSchema,
  updateQuoteInputSchema,
} from "../../../shared/schemas/quote.schema";
import {
  createQuote,
  discardDraft,
  fillMaterialsFromPlan,
  getQuote,
  getQuoteVersion,
  listQuotes,
  reviseQuote,
  updateQuote,
} from "./quotes.service";
import { quotePdf, sendQuote } from "./quote-sending";
import { sendFile } from "../../http/send-file";

/** Quotes are the office's (owner, estimator): painters never see prices, customers use the portal. */
export function quotesRouter(deps: AppDeps) {
  const r = Router();
  r.get("/", allow("office"), (req, res) => {
    res.json(listQuotes(deps, query(req, listQuotesQuerySchema)));
  });
  r.post("/", allow("office"), (req, res) => {
    res.status(201).json(createQuote(deps, ctxOf(req, res), body(req, createQuoteInputSchema).jobId));
  });
  r.get("/:id", allow("office"), (req, res) => {
    res.json(getQuote(deps, params(req, idParamsSchema).id));
  });
  r.patch("/:id", allow("office"), (req, res) => {
    res.json(updateQuote(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, updateQuoteInputSchema)));
  });
  r.delete("/:id", allow("office"), (req, res) => {
    res.json(discardDraft(deps, ctxOf(req, res), params(req, idParamsSchema).id));
  });
  r.post("/:id/versions", allow("office"), (req, res) => {
    res.status(201).json(reviseQuote(deps, ctxOf(req, res), params(req, idParamsSchema).id));
  });
  r.get("/:id/versions/:version", allow("office"), (req, res) => {
    const path = params(req, quoteVersionParamsSchema);
    res.json(getQuoteVersion(deps, path.id, path.version));
  });
  r.post("/:id/fill-materials", allow("office"), (req, res) => {
    res.json(fillMaterialsFromPlan(deps, ctxOf(req, res), params(req, idParamsSchema).id));
  });
  r.get("/:id/pdf", allow("office"), async (req, res) => {
    const id = params(req, idParamsSchema).id;
    const pdf = await quotePdf(deps, id, query(req, quotePdfQuerySchema).version);
    sendFile(res, { data: pdf.content, mime: "application/pdf", name: pdf.filename, disposition: "inline", kept: "generated" });
  });
  r.post("/:id/send", allow("office"), async (req, res) => {
    res.json(await sendQuote(deps, ctxOf(req, res), params(req, idParamsSchema).id, body(req, sendQuoteInputSchema)));
  });
  return r;
}
