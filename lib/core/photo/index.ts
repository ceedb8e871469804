// From a photo to a knittable chart (pure). The edge decodes the picture into RGBA pixels; this
// module crops, resamples by area averaging, works in CIELAB and maps every stitch to a colour by
// CIEDE2000. Method and sources: README.md beside this file.
import { getCiede2000, hexToLab, type Lab } from "../colourwork/ciede2000";
import { isPaletteKey, type ChartV1 } from "../chart/format";
import { MAX_HEIGHT, MAX_PALETTE, MAX_WIDTH, type Chart, type Gauge, type PaletteColour } from "../chart/model";
import { labToHex, linearToLab, SRGB_TO_LINEAR } from "./colour-space";
import { chooseColours, type Seeding } from "./choose-colours";
import { nearestByCiede2000 } from "./nearest-colour";
import { PhotoError } from "./photo-error";
import { resampleArea, type PixelBox } from "./resample";

export { PhotoError } from "./photo-error";
export type { PixelBox } from "./resample";
export { kMeans, seededRandom } from "./kmeans";
export { labToHex, linearToLab } from "./colour-space";
export {
  DEFAULT_MAX_SPECK_STITCHES,
  limitRoundColours,
  MAX_SPECK_STITCHES,
  type ChangedStitch,
  type LimitRoundColoursOptions,
  type LimitRoundColoursResult,
  type RoundPlanCost,
} from "./limit-round-colours";

/** RGBA, 4 bytes per pixel, row-major, top row first. */
export interface RgbaImage {
  width: number;
  height: number;
  data: Uint8Array | Uint8ClampedArray;
}

export interface PhotoToChartOptions {
  /** chart size in stitches × rows (1 to 400 each) */
  width: number;
  height: number;
  gauge: Gauge;
  /** use exactly these colours (2 to 16), in this order */
  palette?: PaletteColour[];
  /** or choose this many colours (2 to 16) */
  colours?: number;
  /** with `colours`: the studio's yarns, each chosen colour is matched to the nearest (ΔE00) */
  yarns?: PaletteColour[];
  /** the part of the image to use, in pixels (default: all of it) */
  crop?: PixelBox;
  cleanup?: { removeIsolated?: boolean };
  /** how each stitch is sampled; the defaults suit both photos and drawn charts */
  sampling?: {
    /** fraction of each stitch's box left out on every side, 0 to 0.45 (default DEFAULT_INSET) */
    inset?: number;
    /** the same, for the sample the colours are chosen from (default DEFAULT_CHOOSE_INSET) */
    chooseInset?: number;
    /** with a palette: map to the palette colours as this photo shows them (default true; README) */
    adapt?: boolean;
    /** average in linear light (default true) or on sRGB values */
    linear?: boolean;
  };
  /** how colours are seeded before k-means (default density peaks; see README) */
  seeding?: Seeding;
  /** PRNG seed for k-means++ seeding (default fixed) */
  seed?: number;
}

export interface YarnMatch {
  key: string;
  name: string;
  hex: string;
  /** CIEDE2000 difference between the chosen colour and this yarn */
  deltaE00: number;
}

export interface PhotoColourReport {
  key: string;
  name: string;
  hex: string;
  stitches: number;
  /** mean ΔE00 between the photo (per stitch) and this colour, over its stitches; null if none */
  meanDeltaE00: number | null;
  /** with `colours` and `yarns`: the nearest studio yarn */
  nearestYarn?: YarnMatch;
}

export interface PhotoReport {
  mode: "palette" | "colours";
  crop: PixelBox;
  /** source pixels per stitch across and per row down */
  pixelsPerStitch: { x: number; y: number };
  colours: PhotoColourReport[];
  /** stitches changed by the isolated-stitch clean-up (0 when it was not asked for) */
  isolatedReplaced: number;
  notes: string[];
}

/** Fraction of each stitch's box left out on every side when sampling (see README: accuracy). */
export const DEFAULT_INSET = 0.25;
/** Inset of the sample the colours are chosen from: wider, so noise averages out and yarns stay apart. */
export const DEFAULT_CHOOSE_INSET = 0.2;
export const MIN_COLOURS = 2;
export const MAX_COLOURS = MAX_PALETTE;

const HEX_RE = /^#[0-9A-Fa-f]{6}$/;

function checkDimension(field: string, value: unknown, max: number): number {
  if (typeof value !== "number" || !Number.isInteger(value)) throw new PhotoError(field, `must be a whole number (got ${String(value)})`);
  if (value < 1 || value > max) throw new PhotoError(field, `must be from 1 to ${max} (got ${value})`);
  return value;
}

function checkGauge(gauge: Gauge | undefined): void {
  if (!gauge || typeof gauge !== "object") throw new PhotoError("gauge", "is missing");
  for (const f of ["stitchesPer10cm", "rowsPer10cm"] as const) {
    const v = gauge[f];
    if (typeof v !== "number" || !Number.isFinite(v) || v <= 0) throw new PhotoError(`gauge.${f}`, `must be a number above 0 (got ${String(v)})`);
  }
}

function checkPalette(field: string, palette: PaletteColour[], min: number): void {
  if (!Array.isArray(palette)) throw new PhotoError(field, "must be a list of colours");
  if (palette.length < min) {
    throw new PhotoError(field, `has ${palette.length} colour${palette.length === 1 ? "" : "s"}; a chart from a photo needs at least ${min}`);
  }
  if (palette.length > MAX_COLOURS) throw new PhotoError(field, `has ${palette.length} colours; a chart allows at most ${MAX_COLOURS}`);
  const seen = new Map<string, number>();
  palette.forEach((c, i) => {
    if (!c || typeof c !== "object") throw new PhotoError(`${field}[${i}]`, "must be a colour { key, name, hex }");
    if (typeof c.key !== "string" || !isPaletteKey(c.key)) {
      throw new PhotoError(`${field}[${i}].key`, `${JSON.stringify(c.key)} must be a single printable character`);
    }
    if (seen.has(c.key)) throw new PhotoError(`${field}[${i}].key`, `'${c.key}' is already used by ${field}[${seen.get(c.key)}]`);
    seen.set(c.key, i);
    if (typeof c.name !== "string" || c.name.trim() === "" || c.name.length > 80) {
      throw new PhotoError(`${field}[${i}].name`, "must be a name of 1 to 80 characters");
    }
    if (typeof c.hex !== "string" || !HEX_RE.test(c.hex)) throw new PhotoError(`${field}[${i}].hex`, `${JSON.stringify(c.hex)} is not a colour of the form #RRGGBB`);
  });
}

function checkImage(image: RgbaImage): void {
  if (!image || typeof image !== "object") throw new PhotoError("image", "is missing");
  const { width, height, data } = image;
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1) {
    throw new PhotoError("image", `must be at least 1 × 1 pixels (got ${String(width)} × ${String(height)})`);
  }
  if (!(data instanceof Uint8Array || data instanceof Uint8ClampedArray) || data.length !== width * height * 4) {
    throw new PhotoError("image", `must hold ${width} × ${height} × 4 bytes of RGBA`);
  }
}

function checkCrop(crop: PixelBox, image: RgbaImage): void {
  for (const f of ["x", "y", "width", "height"] as const) {
    if (typeof crop[f] !== "number" || !Number.isFinite(crop[f])) throw new PhotoError(`crop.${f}`, `must be a number of pixels (got ${String(crop[f])})`);
  }
  if (crop.width <= 0 || crop.height <= 0) throw new PhotoError("crop", `must have a width and height above 0 (got ${crop.width} × ${crop.height})`);
  if (crop.x < 0 || crop.y < 0 || crop.x + crop.width > image.width || crop.y + crop.height > image.height) {
    throw new PhotoError(
      "crop",
      `the box x ${crop.x}, y ${crop.y}, ${crop.width} × ${crop.height} pixels is not inside the image (${image.width} × ${image.height} pixels)`,
    );
  }
}

/** Crop width ÷ height (in pixels) that keeps the area's true proportions for a chart of `width` stitches × `height` rows at `gauge`. */
export function gaugeAspect(width: number, height: number, gauge: Gauge): number {
  // The area is width / sts × 10 cm wide and height / rows × 10 cm tall.
  return (width / gauge.stitchesPer10cm) / (height / gauge.rowsPer10cm);
}

/**
 * The largest whole-pixel box inside `within` (default: the whole image) whose width ÷ height is
 * gaugeAspect(target), centred on `within`'s centre: the crop that fills a `target.width` ×
 * `target.height` chart without stretching the picture.
 */
export function cropForGauge(
  image: { width: number; height: number },
  target: { width: number; height: number; gauge: Gauge },
  within?: PixelBox,
): PixelBox {
  const area = within ?? { x: 0, y: 0, width: image.width, height: image.height };
  const aspect = gaugeAspect(target.width, target.height, target.gauge);
  let w = area.width;
  let h = w / aspect;
  if (h > area.height) {
    h = area.height;
    w = h * aspect;
  }
  const width = Math.max(1, Math.min(image.width, Math.round(w)));
  const height = Math.max(1, Math.min(image.height, Math.round(h)));
  const cx = area.x + area.width / 2;
  const cy = area.y + area.height / 2;
  const x = Math.max(0, Math.min(image.width - width, Math.round(cx - width / 2)));
  const y = Math.max(0, Math.min(image.height - height, Math.round(cy - height / 2)));
  return { x, y, width, height };
}

/** The nearest colour of `palette` (by CIEDE2000) for each chosen colour, with the difference. */
export function matchColoursToPalette(chosen: readonly (string | { hex: string })[], palette: readonly PaletteColour[]): YarnMatch[] {
  if (palette.length === 0) throw new PhotoError("yarns", "must have at least one colour to match against");
  const labs = palette.map((p) => hexToLab(p.hex));
  return chosen.map((c) => {
    const lab = hexToLab(typeof c === "string" ? c : c.hex);
    let best = 0;
    let bestD = Infinity;
    labs.forEach((l, i) => {
      const d = getCiede2000(lab, l);
      if (d < bestD) {
        bestD = d;
        best = i;
      }
    });
    const p = palette[best];
    return { key: p.key, name: p.name, hex: p.hex, deltaE00: round2(bestD) };
  });
}

function round2(v: number): number {
  return Math.round(v * 100) / 100;
}

/** Draws a chart (exchange document or in-memory) as RGBA pixels, each stitch cellWidth × cellHeight. */
export function chartToPixels(chart: ChartV1 | Chart, cellWidth: number, cellHeight: number): RgbaImage {
  for (const [f, v] of [["cellWidth", cellWidth], ["cellHeight", cellHeight]] as const) {
    if (!Number.isInteger(v) || v < 1 || v > 256) throw new PhotoError(f, `must be a whole number of pixels from 1 to 256 (got ${v})`);
  }
  const keyIndex = new Map(chart.palette.map((p, i) => [p.key, i]));
  const rgb = chart.palette.map((p) => {
    const n = parseInt(p.hex.slice(1), 16);
    return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
  });
  // Top row first, as index per cell.
  const grid = new Uint8Array(chart.width * chart.height);
  if ("rows" in chart) {
    chart.rows.forEach((text, r) => {
      let c = 0;
      for (const ch of text) grid[r * chart.width + c++] = keyIndex.get(ch) ?? 0;
    });
  } else {
    for (let r = 0; r < chart.height; r++) {
      const y = chart.height - 1 - r;
      grid.set(chart.cells.subarray(y * chart.width, (y + 1) * chart.width), r * chart.width);
    }
  }
  const width = chart.width * cellWidth;
  const height = chart.height * cellHeight;
  const data = new Uint8ClampedArray(width * height * 4);
  for (let py = 0; py < height; py++) {
    const r = Math.floor(py / cellHeight);
    for (let px = 0; px < width; px++) {
      const colour = rgb[grid[r * chart.width + Math.floor(px / cellWidth)]];
      const o = (py * width + px) * 4;
      data[o] = colour[0];
      data[o + 1] = colour[1];
      data[o + 2] = colour[2];
      data[o + 3] = 255;
    }
  }
  return { width, height, data };
}

/** CIELAB of every cell, 3 numbers per cell, top row first. */
function cellLabs(rgb: Float64Array, linear: boolean): Float64Array {
  const n = rgb.length / 3;
  const out = new Float64Array(rgb.length);
  const toLin = (c: number) => (linear ? c : c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);
  for (let i = 0; i < n; i++) {
    const lab = linearToLab(toLin(rgb[i * 3]), toLin(rgb[i * 3 + 1]), toLin(rgb[i * 3 + 2]));
    out[i * 3] = lab.L;
    out[i * 3 + 1] = lab.a;
    out[i * 3 + 2] = lab.b;
  }
  return out;
}

const assignNearest = nearestByCiede2000;

const ADAPT_DEFAULT = true;

/** Per colour, the mean Lab of the stitches mapped to it that lie within their median difference; the given colour where fewer than 3. */
function observedColours(labs: Float64Array, labels: Uint8Array, distance: Float64Array, given: Lab[]): Lab[] {
  return given.map((lab, j) => {
    const ds: number[] = [];
    for (let i = 0; i < labels.length; i++) if (labels[i] === j) ds.push(distance[i]);
    if (ds.length < 3) return lab;
    ds.sort((a, b) => a - b);
    const limit = ds[Math.floor((ds.length - 1) / 2)];
    let L = 0;
    let a = 0;
    let b = 0;
    let n = 0;
    for (let i = 0; i < labels.length; i++) {
      if (labels[i] !== j || distance[i] > limit) continue;
      L += labs[i * 3];
      a += labs[i * 3 + 1];
      b += labs[i * 3 + 2];
      n++;
    }
    return { L: L / n, a: a / n, b: b / n };
  });
}

/** A stitch whose eight neighbours (those inside the chart) all differ from it takes their most common colour. */
export function removeIsolatedStitches(labels: Uint8Array, width: number, height: number): { labels: Uint8Array; replaced: number } {
  const out = labels.slice();
  let replaced = 0;
  const tally = new Map<number, number>();
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++) {
      const own = labels[r * width + c];
      tally.clear();
      let alone = true;
      let neighbours = 0;
      for (let dr = -1; dr <= 1 && alone; dr++) {
        for (let dc = -1; dc <= 1; dc++) {
          if (dr === 0 && dc === 0) continue;
          const rr = r + dr;
          const cc = c + dc;
          if (rr < 0 || cc < 0 || rr >= height || cc >= width) continue;
          const v = labels[rr * width + cc];
          if (v === own) {
            alone = false;
            break;
          }
          neighbours++;
          tally.set(v, (tally.get(v) ?? 0) + 1);
        }
      }
      if (!alone || neighbours === 0) continue;
      // Most common neighbour; a tie goes to the lower palette index (the main colour first).
      let best = -1;
      let bestCount = 0;
      for (const [v, n] of tally) if (n > bestCount || (n === bestCount && v < best)) [best, bestCount] = [v, n];
      out[r * width + c] = best;
      replaced++;
    }
  }
  return { labels: out, replaced };
}

/** Turns a picture into a chart of `width` × `height` stitches in the given or chosen colours. */
export function photoToChart(image: RgbaImage, options: PhotoToChartOptions): { chart: ChartV1; report: PhotoReport } {
  if (!options || typeof options !== "object") throw new PhotoError("options", "are missing");
  checkImage(image);
  const width = checkDimension("width", options.width, MAX_WIDTH);
  const height = checkDimension("height", options.height, MAX_HEIGHT);
  checkGauge(options.gauge);
  const hasPalette = options.palette !== undefined;
  const hasColours = options.colours !== undefined;
  if (hasPalette === hasColours) throw new PhotoError("palette", "give either a palette of colours to use or a number of colours to choose, not both or neither");
  if (hasPalette) checkPalette("palette", options.palette as PaletteColour[], MIN_COLOURS);
  if (hasColours) {
    const n = options.colours;
    if (typeof n !== "number" || !Number.isInteger(n)) throw new PhotoError("colours", `must be a whole number (got ${String(n)})`);
    if (n < MIN_COLOURS) throw new PhotoError("colours", `must be at least ${MIN_COLOURS}: a chart from a photo needs two colours or more (got ${n})`);
    if (n > MAX_COLOURS) throw new PhotoError("colours", `must be at most ${MAX_COLOURS}, the most a chart allows (got ${n})`);
    if (options.yarns !== undefined) checkPalette("yarns", options.yarns, 1);
  }
  const crop = options.crop ? { x: options.crop.x, y: options.crop.y, width: options.crop.width, height: options.crop.height } : { x: 0, y: 0, width: image.width, height: image.height };
  checkCrop(crop, image);
  const inset = options.sampling?.inset ?? DEFAULT_INSET;
  if (typeof inset !== "number" || !(inset >= 0 && inset <= 0.45)) throw new PhotoError("sampling.inset", `must be from 0 to 0.45 (got ${String(inset)})`);
  const linear = options.sampling?.linear ?? true;
  const ci = options.sampling?.chooseInset;
  if (ci !== undefined && (typeof ci !== "number" || !(ci >= 0 && ci <= 0.45))) throw new PhotoError("sampling.chooseInset", `must be from 0 to 0.45 (got ${String(ci)})`);

  const rgb = resampleArea(image, crop, width, height, { inset, linear });
  const labs = cellLabs(rgb, linear);
  const notes: string[] = [];

  let palette: PaletteColour[];
  let labels: Uint8Array;
  let distance: Float64Array;
  if (hasPalette) {
    palette = (options.palette as PaletteColour[]).map((p) => ({ key: p.key, name: p.name, hex: p.hex }));
    const given = palette.map((p) => hexToLab(p.hex));
    ({ labels, distance } = assignNearest(labs, given));
    if (options.sampling?.adapt ?? ADAPT_DEFAULT) {
      // The palette as this photo shows it (light, blur from neighbours, compression shift every yarn a
      // little): each colour moved to the mean of the purer half of its stitches, then mapped again.
      const seen = observedColours(labs, labels, distance, given);
      labels = assignNearest(labs, seen).labels;
      distance = new Float64Array(labels.length);
      for (let i = 0; i < labels.length; i++) distance[i] = getCiede2000({ L: labs[i * 3], a: labs[i * 3 + 1], b: labs[i * 3 + 2] }, given[labels[i]]);
    }
  } else {
    const k = options.colours as number;
    // Colours are chosen from a wider sample of each stitch than the one used to map it (see README).
    const chooseInset = options.sampling?.chooseInset ?? DEFAULT_CHOOSE_INSET;
    const chooseLabs = chooseInset === inset ? labs : cellLabs(resampleArea(image, crop, width, height, { inset: chooseInset, linear }), linear);
    const centres = chooseColours(chooseLabs, k, { seeding: options.seeding, seed: options.seed });
    const centreLabs: Lab[] = [];
    for (let j = 0; j < k; j++) centreLabs.push({ L: centres[j * 3], a: centres[j * 3 + 1], b: centres[j * 3 + 2] });
    const first = assignNearest(labs, centreLabs);
    // The most used colour first: index 0 is the chart's main colour.
    const counts = new Array<number>(k).fill(0);
    for (const l of first.labels) counts[l]++;
    const order = counts.map((n, j) => [n, j]).sort((p, q) => q[0] - p[0] || p[1] - q[1]).map(([, j]) => j);
    const rank = new Uint8Array(k);
    order.forEach((j, r) => (rank[j] = r));
    labels = first.labels.map((l) => rank[l]);
    distance = first.distance;
    palette = order.map((j, r) => ({ key: String.fromCharCode(65 + r), name: `Colour ${r + 1}`, hex: labToHex(centreLabs[j]) }));
    const seen = new Set<string>();
    for (const p of palette) {
      if (seen.has(p.hex)) notes.push(`the picture has fewer than ${k} distinct colours; ${p.name} repeats another`);
      seen.add(p.hex);
    }
  }

  let isolatedReplaced = 0;
  if (options.cleanup?.removeIsolated) {
    const cleaned = removeIsolatedStitches(labels, width, height);
    labels = cleaned.labels;
    isolatedReplaced = cleaned.replaced;
  }

  const rows: string[] = [];
  for (let r = 0; r < height; r++) {
    let text = "";
    for (let c = 0; c < width; c++) text += palette[labels[r * width + c]].key;
    rows.push(text);
  }

  const stitches = new Array<number>(palette.length).fill(0);
  const distSum = new Array<number>(palette.length).fill(0);
  const paletteLabs = palette.map((p) => hexToLab(p.hex));
  for (let i = 0; i < labels.length; i++) {
    const l = labels[i];
    stitches[l]++;
    // After clean-up a stitch may hold a colour other than its nearest: measure against the one it holds.
    distSum[l] += isolatedReplaced ? getCiede2000({ L: labs[i * 3], a: labs[i * 3 + 1], b: labs[i * 3 + 2] }, paletteLabs[l]) : distance[i];
  }
  const matches = hasColours && options.yarns ? matchColoursToPalette(palette, options.yarns) : null;
  const colours: PhotoColourReport[] = palette.map((p, i) => ({
    key: p.key,
    name: p.name,
    hex: p.hex,
    stitches: stitches[i],
    meanDeltaE00: stitches[i] ? round2(distSum[i] / stitches[i]) : null,
    ...(matches ? { nearestYarn: matches[i] } : {}),
  }));

  const stretch = crop.width / crop.height / gaugeAspect(width, height, options.gauge);
  if (Math.abs(stretch - 1) > 0.02) {
    notes.push(
      `the crop is ${Math.round(Math.abs(stretch - 1) * 100)} % ${stretch > 1 ? "wider" : "narrower"} than the area at this gauge, so the knitted picture is ${stretch > 1 ? "squeezed across" : "stretched across"}; cropForGauge gives a box with the true proportions`,
    );
  }
  for (const c of colours) if (hasPalette && c.stitches === 0) notes.push(`${c.name} (${c.key}) is not used`);
  if (matches) {
    const byYarn = new Map<string, string[]>();
    colours.forEach((c) => byYarn.set(c.nearestYarn!.key, [...(byYarn.get(c.nearestYarn!.key) ?? []), c.name]));
    for (const [key, names] of byYarn) if (names.length > 1) notes.push(`${names.join(" and ")} are all nearest to the yarn ${key}`);
  }
  if (crop.width < width || crop.height < height) notes.push("the crop has fewer pixels than the chart has stitches; the chart will look blocky");

  const chart: ChartV1 = {
    version: 1,
    width,
    height,
    gauge: { stitchesPer10cm: options.gauge.stitchesPer10cm, rowsPer10cm: options.gauge.rowsPer10cm },
    palette,
    rows,
  };
  return {
    chart,
    report: {
      mode: hasPalette ? "palette" : "colours",
      crop,
      pixelsPerStitch: { x: round2(crop.width / width), y: round2(crop.height / height) },
      colours,
      isolatedReplaced,
      notes,
    },
  };
}

// Re-exported so callers can sample a picture the same way without building a chart.
export { resampleArea, SRGB_TO_LINEAR };
