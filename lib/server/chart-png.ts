import "server-only";
// Charts as PNG for e-mails and PDFs: the core draws SVG, sharp (librsvg) turns it into pixels.
import sharp from "sharp";
import { renderChartSvg, renderPreviewSvg, type Chart } from "@/lib/core/chart";

export interface PngOptions {
  /** widest the picture may be, in pixels (it is scaled down to fit, never up) */
  maxWidthPx?: number;
}

export async function svgToPng(svg: string, options: PngOptions = {}): Promise<Buffer> {
  let img = sharp(Buffer.from(svg), { density: 96, limitInputPixels: 64_000_000 });
  if (options.maxWidthPx) img = img.resize({ width: options.maxWidthPx, withoutEnlargement: true });
  return img.png({ compressionLevel: 9 }).toBuffer();
}

/** The chart with grid, numbers, a symbol per colour and the colour key. */
export async function renderChartPng(chart: Chart, options: PngOptions & { cellPx?: number; title?: string } = {}): Promise<Buffer> {
  const cellPx = options.cellPx ?? Math.max(6, Math.min(16, Math.floor(1200 / chart.width)));
  return svgToPng(renderChartSvg(chart, { cellPx, title: options.title }), options);
}

/** The knitted preview at the fabric's true proportions. */
export async function renderPreviewPng(chart: Chart, options: PngOptions & { stitchPx?: number; title?: string } = {}): Promise<Buffer> {
  const stitchPx = options.stitchPx ?? Math.max(4, Math.min(12, Math.floor(900 / chart.width)));
  return svgToPng(renderPreviewSvg(chart, { stitchPx, title: options.title }), options);
}
