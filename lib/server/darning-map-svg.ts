// A darned colour's route as an SVG stitch map for print: each stitch numbered in the needle's
// order, a ring where a strand starts, a square where it ends, carries as dashed lines.
import { escapeXml, type ChartV1 } from "@/lib/core/chart";
import type { ColourDarning } from "@/lib/core/colourwork/darn-colour";

export function renderDarningMapSvg(chart: ChartV1, colour: ColourDarning, options: { maxWidthPx?: number } = {}): string {
  // Only the part of the chart the colour lives in (and a stitch around it), so numbers stay legible.
  const all = colour.strands.flatMap((s) => s.stitches);
  const minS = Math.max(1, Math.min(...all.map((s) => s.stitch), chart.width) - 1);
  const maxS = Math.min(chart.width, Math.max(...all.map((s) => s.stitch), 1) + 1);
  const minR = Math.max(1, Math.min(...all.map((s) => s.row), chart.height) - 1);
  const maxR = Math.min(chart.height, Math.max(...all.map((s) => s.row), 1) + 1);
  const cols = maxS - minS + 1;
  const rowsN = maxR - minR + 1;
  const cell = Math.max(10, Math.min(24, Math.floor((options.maxWidthPx ?? 900) / cols)));
  const rowH = Math.max(8, Math.round((cell * chart.gauge.stitchesPer10cm) / chart.gauge.rowsPer10cm));
  const w = cols * cell;
  const h = rowsN * rowH;
  const cx = (stitch: number) => (maxS - stitch + 0.5) * cell;
  const cy = (row: number) => (maxR - row + 0.5) * rowH;
  const hex = new Map(chart.palette.map((c) => [c.key, c.hex]));
  const parts: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}">`,
    `<title>${escapeXml(`Darning route for ${colour.name}, rows ${minR}–${maxR}, stitches ${minS}–${maxS}`)}</title>`,
    `<rect width="${w}" height="${h}" fill="#FFFFFF"/>`,
  ];
  for (let row = maxR; row >= minR; row--) {
    const text = Array.from(chart.rows[chart.height - row]);
    for (let stitch = maxS; stitch >= minS; stitch--) {
      const k = text[chart.width - stitch];
      const own = k === colour.key;
      parts.push(
        `<rect x="${(maxS - stitch) * cell}" y="${(maxR - row) * rowH}" width="${cell}" height="${rowH}" fill="${own ? hex.get(k) : "#FFFFFF"}" fill-opacity="${own ? 0.35 : 1}" stroke="#CCCCCC" stroke-width="0.5"/>`,
      );
    }
  }
  const font = Math.max(6, Math.min(11, Math.floor(Math.min(cell, rowH) * 0.55)));
  let n = 0;
  for (const strand of colour.strands) {
    strand.stitches.forEach((s, i) => {
      if (i === 0) return;
      const p = strand.stitches[i - 1];
      const dash = (s.carryCm ?? 0) > 0 ? ` stroke-dasharray="4 3"` : "";
      parts.push(`<line x1="${cx(p.stitch)}" y1="${cy(p.row)}" x2="${cx(s.stitch)}" y2="${cy(s.row)}" stroke="#333333" stroke-width="1"${dash}/>`);
    });
  }
  for (const strand of colour.strands) {
    strand.stitches.forEach((s, i) => {
      n++;
      if (i === 0) parts.push(`<circle cx="${cx(s.stitch)}" cy="${cy(s.row)}" r="${Math.min(cell, rowH) / 2 - 0.5}" fill="none" stroke="#000000" stroke-width="1.6"/>`);
      if (i === strand.stitches.length - 1) {
        parts.push(`<rect x="${cx(s.stitch) - cell / 2 + 1}" y="${cy(s.row) - rowH / 2 + 1}" width="${cell - 2}" height="${rowH - 2}" fill="none" stroke="#000000" stroke-width="1.6"/>`);
      }
      parts.push(
        `<text x="${cx(s.stitch)}" y="${cy(s.row) + font * 0.35}" font-family="sans-serif" font-size="${font}" text-anchor="middle" fill="#000000">${n}</text>`,
      );
    });
  }
  parts.push("</svg>");
  return parts.join("");
}
