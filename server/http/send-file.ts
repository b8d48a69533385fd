import { create as contentDisposition } from "content-disposition";
import type { Response } from "express";

export type FileToSend = {
  data: Buffer | string;
  mime: string;
  /** The name the browser shows or saves it under; any characters (quoted and encoded by content-disposition). */
  name: string;
  /** Open it in the browser (photos, PDFs), or download it (exports, e-mail copies). */
  disposition: "inline" | "attachment";
  /**
   * A stored file never changes under its id, so the browser may keep it for an hour (private: it is behind a
   * sign-in). A generated document (a PDF or an export) is made from records that change: never kept.
   */
  kept: "stored" | "generated";
};

/** Sends a file or document with one set of headers for every route that serves one. */
export function sendFile(res: Response, file: FileToSend) {
  res.set({
    "Content-Type": file.mime,
    "Content-Disposition": contentDisposition(file.name, { type: file.disposition }),
    "Cache-Control": file.kept === "stored" ? "private, max-age=3600" : "no-store",
  });
  res.end(file.data);
}
