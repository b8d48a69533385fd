import type { ErrorRequestHandler, RequestHandler } from "express";
import { ZodError } from "zod";
import { HttpError, isStorageFull, storageFull } from "./http-error";
import { zodFields } from "./validate";
import { MixError } from "../../shared/mix/index";
import multer from "multer";

export const notFoundHandler: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: "not_found", message: `No API route for ${req.method} ${req.path}` } });
};

type BodyParserError = Error & { type?: string; status?: number; statusCode?: number };

/** The one place that decides an error's status and body. Unknown errors are logged and answered without details. */
export const errorHandler: ErrorRequestHandler = (err: unknown, _req, res, _next) => {
  if (res.headersSent) return;
  if (isStorageFull(err)) {
    // The request's log line (a 5xx, so at error level) carries the disk error: the owner's log says why it was refused.
    res.err = err instanceof Error ? err : new Error(String(err));
    err = storageFull();
  }
  if (err instanceof HttpError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}), ...err.extra } });
    return;
  }
  if (err instanceof ZodError) {
    res.status(400).json({ error: { code: "validation_failed", message: "Check the highlighted fields", fields: zodFields(err) } });
    return;
  }
  if (err instanceof MixError) {
    res.status(400).json({ error: { code: "validation_failed", message: err.message, fields: { [err.field ?? "components"]: err.message } } });
    return;
  }
  if (err instanceof multer.MulterError) {
    const tooBig = err.code === "LIMIT_FILE_SIZE";
    res.status(tooBig ? 413 : 400).json({
      error: {
        code: tooBig ? "payload_too_large" : "bad_request",
        message: tooBig ? "The file is larger than the upload limit; send a smaller file" : `Upload problem: ${err.message}`,
        fields: { [err.field ?? "file"]: tooBig ? "File too large" : err.message },
      },
    });
    return;
  }
  const e = err as BodyParserError;
  if (e?.type === "entity.parse.failed") {
    res.status(400).json({ error: { code: "bad_request", message: "The request body is not valid JSON" } });
    return;
  }
  if (e?.type === "entity.too.large") {
    res.status(413).json({ error: { code: "payload_too_large", message: "The request body is too large" } });
    return;
  }
  const status = e?.status ?? e?.statusCode;
  if (typeof status === "number" && status >= 400 && status < 500) {
    res.status(status).json({ error: { code: "bad_request", message: e.message || "Bad request" } });
    return;
  }
  // The request's log line (http/request-log.ts) carries the error and its stack, under the request id the body quotes.
  res.err = err instanceof Error ? err : new Error(String(err));
  res.status(500).json({ error: { code: "internal", message: "Something went wrong on our side. Nothing you sent was lost; try again." } });
};
