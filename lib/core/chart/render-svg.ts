// Chart → SVG: a working chart (grid, trade numbering, a symbol per colour so it reads in black and
// white, a colour key) and a knitted preview at the true stitch proportions of the gauge.
import { darken, getMarkColour } from "./colour";
import { getStitchCounts } from "./counts";
import type { Chart } from "./model";

export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (ch) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[ch] as string);
}

/** Two decimals are finer than any screen or printer needs and keep the file small. */
function n(v: number): string {
  return String(Math.round(v * 100) / 100);
}

// Marks drawn in a 10 × 10 box, one per palette index; index 0 (usually the main colour) stays blank
// as on printed charts. Lines use the stroke, solid shapes the fill; both are set per colour.
const SYMBOLS: readonly string[] = [
  "",
  '<circle cx="5" cy="5" r="1.7" stroke="none"/>',
  '<path d="M2.5 2.5L7.5 7.5M7.5 2.5L2.5 7.5" fill="none"/>',
  '<path d="M2.5 7.5L7.5 2.5" fill="none"/>',
  '<path d="M2.5 2.5L7.5 7.5" fill="none"/>',
  '<circle cx="5" cy="5" r="2.6" fill="none"/>',
  '<rect x="3" y="3" width="4" height="4" stroke="none"/>',
  '<path d="M5 2.2L7.8 7.6H2.2Z" fill="none"/>',
  '<path d="M5 2L8 5L5 8L2 5Z" stroke="none"/>',
  '<path d="M5 2V8M2 5H8" fill="none"/>',
  '<path d="M2 5H8" fill="none"/>',
  '<path d="M5 2V8" fill="none"/>',
  '<circle cx="5" cy="5" r="2.8" fill="none"/><circle cx="5" cy="5" r="0.9" stroke="none"/>',
  '<path d="M5 2.2V7.8M2.6 3.6L7.4 6.4M7.4 3.6L2.6 6.4" fill="none"/>',
  '<path d="M2.2 2.6H7.8L5 7.8Z" stroke="none"/>',
  '<path d="M2.2 7L5 3L7.8 7" fill="none"/>',
];

export interface ChartSvgOptions {
  /** pixel size of one stitch square (default 16) */
  cellPx?: number;
  /** heading above the chart */
  title?: string;
  /** the colour key under the chart (default true) */
  showKey?: boolean;
}

/** The smallest of 1, 5, 10, 20, 50, 100 (the steps knitters count in) that leaves `need` pixels between labels. */
function labelStep(cellPx: number, need: number): number {
  for (const step of [1, 5, 10, 20, 50, 100]) if (step * cellPx >= need) return step;
  return 100;
}

function symbolDef(index: number, cellPx: number, fill: string): string {
  const mark = getMarkColour(fill);
  const k = n(cellPx / 10);
  return `<g id="dw-sym-${index}" transform="scale(${k})" fill="${mark}" stroke="${mark}" stroke-width="1.1" stroke-linecap="round">${SYMBOLS[index]}</g>`;
}

export function renderChartSvg(chart: Chart, options: ChartSvgOptions = {}): string {
  const c = options.cellPx ?? 16;
  const showKey = options.showKey ?? true;
  const font = Math.max(7, Math.min(12, Math.round(c * 0.7)));
  const digits = String(Math.max(chart.width, chart.height)).length;
  const pad = 12;
  const titleH = options.title ? font + 14 : 0;
  const gx = pad;
  const gy = pad + titleH;
  const gw = chart.width * c;
  const gh = chart.height * c;
  const numbersW = Math.ceil(digits * font * 0.65) + 8;
  const numbersH = font + 8;
  const keyRow = Math.max(c, font + 6) + 4;
  const keyH = showKey ? 10 + keyRow * chart.palette.length : 0;
  const counts = getStitchCounts(chart);
  const keyTexts = chart.palette.map(
    (p, i) => `${p.key}  ${p.name} (${p.hex}) · ${counts[i]} stitch${counts[i] === 1 ? "" : "es"}`,
  );
  const keyW = showKey ? c + 10 + Math.ceil(Math.max(...keyTexts.map((t) => t.length)) * font * 0.6) : 0;
  const width = Math.max(gx + gw + numbersW, pad + keyW) + pad;
  const height = gy + gh + numbersH + keyH + pad;
  const parts: string[] = [];
  const used = new Set<number>();

  parts.push(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" role="img" font-family="system-ui, sans-serif">`,
    `<title>${escapeXml(options.title ?? "Colourwork chart")} (${chart.width} stitches × ${chart.height} rows)</title>`,
    `<rect width="${width}" height="${height}" fill="#FFFFFF"/>`,
  );
  if (options.title) {
    parts.push(`<text x="${gx}" y="${pad + font + 2}" font-size="${font + 3}" font-weight="600" fill="#222222">${escapeXml(options.title)}</text>`);
  }

  // Fills: one rectangle per run of a colour along a row keeps the file small.
  const cells: string[] = [];
  for (let y = 0; y < chart.height; y++) {
    const top = gy + (chart.height - 1 - y) * c;
    let x = 0;
    while (x < chart.width) {
      const colour = chart.cells[y * chart.width + x];
      let end = x + 1;
      while (end < chart.width && chart.cells[y * chart.width + end] === colour) end++;
      parts.push(`<rect x="${gx + x * c}" y="${top}" width="${(end - x) * c}" height="${c}" fill="${chart.palette[colour].hex}"/>`);
      if (SYMBOLS[colour]) {
        used.add(colour);
        for (let i = x; i < end; i++) cells.push(`<use href="#dw-sym-${colour}" x="${gx + i * c}" y="${top}"/>`);
      }
      x = end;
    }
  }
  const defs = [...used].sort((a, b) => a - b).map((i) => symbolDef(i, c, chart.palette[i].hex));
  if (showKey) {
    chart.palette.forEach((p, i) => {
      if (SYMBOLS[i] && !used.has(i)) defs.push(symbolDef(i, c, p.hex));
    });
  }
  parts.splice(3, 0, `<defs>${defs.join("")}</defs>`);
  parts.push(...cells);

  // Grid: thin line per stitch, bold every 10 counted from the right and from the bottom (trade numbering).
  let thin = "";
  let bold = `M${gx} ${gy}h${gw}v${gh}h${-gw}Z`;
  for (let b = 1; b < chart.width; b++) {
    const seg = `M${gx + b * c} ${gy}v${gh}`;
    if ((chart.width - b) % 10 === 0) bold += seg;
    else thin += seg;
  }
  for (let y = 1; y < chart.height; y++) {
    const seg = `M${gx} ${gy + gh - y * c}h${gw}`;
    if (y % 10 === 0) bold += seg;
    else thin += seg;
  }
  if (thin) parts.push(`<path d="${thin}" stroke="#555555" stroke-opacity="0.55" stroke-width="0.6" fill="none"/>`);
  parts.push(`<path d="${bold}" stroke="#111111" stroke-width="1.6" fill="none"/>`);

  // Row numbers up the right side, stitch numbers along the bottom from the right.
  const rowStep = labelStep(c, font + 1);
  for (let row = 1; row <= chart.height; row++) {
    if (row !== 1 && row % rowStep !== 0) continue;
    const cy = gy + gh - (row - 0.5) * c;
    parts.push(`<text x="${gx + gw + 4}" y="${n(cy + font * 0.35)}" font-size="${font}" fill="#333333">${row}</text>`);
  }
  const stitchStep = labelStep(c, Math.ceil(digits * font * 0.62) + 2);
  for (let stitch = 1; stitch <= chart.width; stitch++) {
    if (stitch !== 1 && stitch % stitchStep !== 0) continue;
    const cx = gx + (chart.width - stitch + 0.5) * c;
    parts.push(`<text x="${n(cx)}" y="${gy + gh + font + 3}" font-size="${font}" text-anchor="middle" fill="#333333">${stitch}</text>`);
  }

  if (showKey) {
    const ky = gy + gh + numbersH + 10;
    chart.palette.forEach((p, i) => {
      const y = ky + i * keyRow;
      parts.push(`<rect x="${pad}" y="${y}" width="${c}" height="${c}" fill="${p.hex}" stroke="#111111" stroke-width="0.8"/>`);
      if (SYMBOLS[i]) parts.push(`<use href="#dw-sym-${i}" x="${pad}" y="${y}"/>`);
      parts.push(`<text x="${pad + c + 8}" y="${n(y + c / 2 + font * 0.35)}" font-size="${font}" fill="#222222">${escapeXml(keyTexts[i])}</text>`);
    });
  }
  parts.push("</svg>");
  return parts.join("");
}

export interface PreviewSvgOptions {
  /** pixel width of one stitch (default 12); its height follows from the gauge */
  stitchPx?: number;
  title?: string;
}

/**
 * The chart as knitted fabric: each stitch a V of two leaning loops, drawn w = 10 / stitchesPer10cm
 * wide and h = 10 / rowsPer10cm tall (scaled together), so the picture has the fabric's proportions.
 */
export function renderPreviewSvg(chart: Chart, options: PreviewSvgOptions = {}): string {
  const w = options.stitchPx ?? 12;
  const cmW = 10 / chart.gauge.stitchesPer10cm;
  const cmH = 10 / chart.gauge.rowsPer10cm;
  const h = (w * cmH) / cmW;
  const width = Math.ceil(chart.width * w);
  const height = Math.ceil(chart.height * h);
  const sizeCm = `${n(chart.width * cmW)} × ${n(chart.height * cmH)} cm`;
  // One leg of the V, from the foot at the bottom centre up to the top outer corner.
  const leg = (s: 1 | -1) => {
    const x = (f: number) => n(w / 2 + s * (f - 0.5) * w);
    const y = (f: number) => n(f * h);
    return `M${x(0.5)} ${y(0.96)}C${x(0.16)} ${y(0.86)} ${x(0.02)} ${y(0.4)} ${x(0.08)} ${y(0.04)}C${x(0.34)} ${y(0.1)} ${x(0.5)} ${y(0.5)} ${x(0.5)} ${y(0.96)}Z`;
  };
  const parts: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" role="img">`,
    `<title>${escapeXml(options.title ?? "Knitted preview")} (${sizeCm} at ${chart.gauge.stitchesPer10cm} stitches and ${chart.gauge.rowsPer10cm} rows per 10 cm)</title>`,
    `<defs><g id="dw-st" stroke="#000000" stroke-opacity="0.22" stroke-width="${n(Math.max(0.4, w / 24))}"><path d="${leg(1)}"/><path d="${leg(-1)}"/></g></defs>`,
  ];
  // The gaps between loops show a darker shade of the stitch colour, as the fabric does.
  const byColour = new Map<number, string[]>();
  for (let y = 0; y < chart.height; y++) {
    const top = n((chart.height - 1 - y) * h);
    let x = 0;
    while (x < chart.width) {
      const colour = chart.cells[y * chart.width + x];
      let end = x + 1;
      while (end < chart.width && chart.cells[y * chart.width + end] === colour) end++;
      parts.push(`<rect x="${n(x * w)}" y="${top}" width="${n((end - x) * w)}" height="${n(h)}" fill="${darken(chart.palette[colour].hex, 0.35)}"/>`);
      const list = byColour.get(colour) ?? [];
      for (let i = x; i < end; i++) list.push(`<use href="#dw-st" x="${n(i * w)}" y="${top}"/>`);
      byColour.set(colour, list);
      x = end;
    }
  }
  for (const [colour, uses] of byColour) parts.push(`<g fill="${chart.palette[colour].hex}">${uses.join("")}</g>`);
  parts.push("</svg>");
  return parts.join("");
}
