import "server-only";
// PDFs with @react-pdf/renderer and the fonts we ship (nothing fetched at run time).
import path from "node:path";
import { Font, renderToBuffer } from "@react-pdf/renderer";
import { cloneElement, isValidElement, type ReactElement } from "react";
import { printableText } from "@/lib/core/text/printable";

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
  // Fallbacks for letters and symbols our typefaces lack (fonts/LICENSE-dejavu.txt, fonts/LICENSE-droid-sans-fallback.txt).
  Font.register({
    family: "DejaVu Sans",
    fonts: [
      { src: f("DejaVuSans.ttf"), fontWeight: 400 },
      { src: f("DejaVuSans-Bold.ttf"), fontWeight: 700 },
      { src: f("DejaVuSans.ttf"), fontWeight: 400, fontStyle: "italic" },
      { src: f("DejaVuSans-Bold.ttf"), fontWeight: 600 },
    ],
  });
  Font.register({
    family: "Droid Sans Fallback",
    fonts: [
      { src: f("DroidSansFallbackFull.ttf"), fontWeight: 400 },
      { src: f("DroidSansFallbackFull.ttf"), fontWeight: 400, fontStyle: "italic" },
    ],
  });
  // Droid Sans Fallback has no precomposed Hangul syllables: Korean comes from Nanum Gothic (fonts/LICENSE-nanum.txt).
  Font.register({
    family: "Nanum Gothic",
    fonts: [
      { src: f("NanumGothic.ttf"), fontWeight: 400 },
      { src: f("NanumGothic.ttf"), fontWeight: 400, fontStyle: "italic" },
    ],
  });
  // Words are not hyphenated in our documents.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}

// react-pdf's own element types are narrower than React's; documents are built from its components.
type PdfDocument = Parameters<typeof renderToBuffer>[0];

/**
 * Every string in a document's element tree (children and props, nested plain objects and arrays)
 * through `printableText`, so a name or note with emoji or unusual characters prints as words.
 * Buffers, dates and functions are left alone.
 */
export function printableTree(node: unknown, depth = 0): unknown {
  if (depth > 64) return node;
  if (typeof node === "string") return printableText(node);
  if (Array.isArray(node)) return node.map((n) => printableTree(n, depth + 1));
  if (isValidElement(node)) {
    const props = node.props as Record<string, unknown>;
    return cloneElement(node, printableTree(props, depth + 1) as Record<string, unknown>);
  }
  if (node && typeof node === "object") {
    const proto = Object.getPrototypeOf(node);
    if (proto !== Object.prototype && proto !== null) return node;
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(node)) out[k] = k === "style" || k === "src" ? v : printableTree(v, depth + 1);
    return out;
  }
  return node;
}

export async function renderPdf(doc: ReactElement): Promise<Buffer> {
  registerPdfFonts();
  return renderToBuffer(printableTree(doc) as PdfDocument);
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
