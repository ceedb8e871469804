import "server-only";
// PDFs with @react-pdf/renderer and the fonts we ship (nothing fetched at run time).
import path from "node:path";
import { Font, renderToBuffer } from "@react-pdf/renderer";
import type { ReactElement } from "react";

let registered = false;

export function registerPdfFonts(): void {
  if (registered) return;
  const f = (name: string) => path.join(process.cwd(), "fonts", name);
  Font.register({
    family: "Atkinson Hyperlegible",
    fonts: [
      { src: f("atkinson-hyperlegible-latin-400-normal.woff"), fontWeight: 400 },
      { src: f("atkinson-hyperlegible-latin-700-normal.woff"), fontWeight: 700 },
      { src: f("atkinson-hyperlegible-latin-400-italic.woff"), fontWeight: 400, fontStyle: "italic" },
    ],
  });
  Font.register({ family: "Fraunces", fonts: [{ src: f("fraunces-latin-600-normal.woff"), fontWeight: 600 }] });
  // Words are not hyphenated in our documents.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}

// react-pdf's own element types are narrower than React's; documents are built from its components.
type PdfDocument = Parameters<typeof renderToBuffer>[0];

export async function renderPdf(doc: ReactElement): Promise<Buffer> {
  registerPdfFonts();
  return renderToBuffer(doc as PdfDocument);
}

export function pdfResponse(buf: Buffer, filename: string): Response {
  return new Response(new Uint8Array(buf), {
    headers: {
      "content-type": "application/pdf",
      "content-disposition": `attachment; filename="${filename.replace(/[^\w.-]+/g, "-")}"`,
      "cache-control": "private, no-store",
    },
  });
}
