import "server-only";
// A PNG of the knitted preview for e-mail (mail clients do not show SVG).
import sharp from "sharp";
import { renderPreviewSvg, type Chart } from "@/lib/core/chart";

export async function previewPng(chart: Chart, title: string, maxWidth = 560): Promise<Buffer> {
  const stitchPx = Math.max(4, Math.min(14, Math.floor(maxWidth / chart.width)));
  const svg = renderPreviewSvg(chart, { stitchPx, title });
  return sharp(Buffer.from(svg)).flatten({ background: "#ffffff" }).png({ compressionLevel: 9 }).toBuffer();
}
