import PDFDocument from "pdfkit";
import { createRequire } from "node:module";

/** Inter, embedded from the installed @fontsource files (WOFF, which pdfkit's fontkit reads). Latin subset. */
const require = createRequire(import.meta.url);
const FONTS = {
  regular: require.resolve("@fontsource/inter/files/inter-latin-400-normal.woff"),
  medium: require.resolve("@fontsource/inter/files/inter-latin-500-normal.woff"),
  bold: require.resolve("@fontsource/inter/files/inter-latin-700-normal.woff"),
};

/** Figures in columns: tabular digits and no kerning (Inter kerns "7." so tightly that $617.50 reads as $61750). */
export const NUM = { features: { kern: false, tnum: true } as unknown as PDFKit.Mixins.OpenTypeFeatures[] };

export const INK = "#17202a";
export const MUTED = "#4b5866";
export const RULE = "#c9d0d8";
export const ACCENT = "#9f1239";

/**
 * A US Letter document in Inter ("body", "medium", "bold") with the helpers every Coatwright PDF uses; `done`
 * resolves with the bytes once `doc.end()` is called.
 */
export function newPdfDocument(info: { Title: string; Author: string; Subject: string }) {
  const doc = new PDFDocument({ size: "LETTER", margins: { top: 54, bottom: 64, left: 54, right: 54 }, bufferPages: true, info: { ...info, Creator: "Coatwright" } });
  doc.registerFont("body", FONTS.regular);
  doc.registerFont("medium", FONTS.medium);
  doc.registerFont("bold", FONTS.bold);
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });
  const left = doc.page.margins.left;
  const width = doc.page.width - doc.page.margins.left - doc.page.margins.right;
  const bottom = () => doc.page.height - doc.page.margins.bottom;
  /** Starts a new page unless `h` points still fit. */
  const ensure = (h: number) => {
    if (doc.y + h > bottom()) doc.addPage();
  };
  const heading = (text: string) => {
    ensure(40);
    doc.moveDown(0.8);
    doc.font("bold").fontSize(10.5).fillColor(ACCENT).text(text.toUpperCase(), left, doc.y, { characterSpacing: 0.6 });
    doc.moveDown(0.25);
    doc.fillColor(INK);
  };
  /** The same small line at the foot of every page, with "Page n of m". */
  const footer = (text: string) => {
    const range = doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i++) {
      doc.switchToPage(i);
      const y = doc.page.height - 40;
      doc.font("body").fontSize(8).fillColor(MUTED);
      // Writing inside the bottom margin: lift it so pdfkit does not start a new page.
      const saved = doc.page.margins.bottom;
      doc.page.margins.bottom = 0;
      doc.text(`${text}  ·  Page ${i - range.start + 1} of ${range.count}`, left, y, { width, align: "center", lineBreak: false });
      doc.page.margins.bottom = saved;
    }
  };
  return { doc, done, left, width, bottom, ensure, heading, footer };
}
