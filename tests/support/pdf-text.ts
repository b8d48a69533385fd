import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";

/** The whole text of a PDF (pdfjs-dist), items joined without separators so kerning splits do not matter. */
export async function pdfText(bytes: Buffer | Uint8Array): Promise<string> {
  const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false }).promise;
  let text = "";
  for (let n = 1; n <= doc.numPages; n++) {
    const content = await (await doc.getPage(n)).getTextContent();
    text += content.items.map((i) => ("str" in i ? i.str : "")).join("") + "\n";
  }
  return text;
}

/** supertest parser that collects a binary body into a Buffer. */
export function binary(res: { on: (e: string, cb: (c?: Buffer) => void) => void }, cb: (err: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on("data", (c) => chunks.push(c!));
  res.on("end", () => cb(null, Buffer.concat(chunks)));
}
