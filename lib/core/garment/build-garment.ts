// Sizing → garment: pieces one by one (a pair is a left and a right piece), each part's rounds
// with their stitch counts and which stitches belong to which area. The round counts and the
// in-shape stitches of each chart row come from the sizing templates (one source of truth); this
// file only lays them out around the round.
import { sizeGarment } from "../sizing/size-garment";
import type { ChartArea, Piece, SizingResult } from "../sizing/sizing-result";
import { GarmentError } from "./garment-error";
import type { Garment, GarmentArea, GarmentPart, GarmentPiece, GarmentRound, Narrowing, RoundSpan } from "./types";

/** Sizes the garment (the `size` verb's input) and builds its model. */
export function buildGarment(sizeInput: unknown): Garment {
  return garmentFromSizing(sizeGarment(sizeInput));
}

/**
 * Chart columns (x from the left) of the `n` in-shape stitches of a row `width` wide, in knitting
 * order (from the right). "edges": decreases at both edges, the stitches stay centred; "sector end":
 * the sector loses stitches at its end in knitting order, its left; "even": spread evenly.
 */
export function inShapeColumns(width: number, n: number, narrowing: Narrowing): number[] {
  if (!Number.isInteger(n) || n < 0 || n > width) throw new RangeError(`a row of ${width} cannot hold ${n} stitches`);
  let keep: (x: number) => boolean;
  if (n === width) keep = () => true;
  else if (narrowing === "edges") {
    const left = Math.floor((width - n) / 2);
    keep = (x) => x >= left && x < left + n;
  } else if (narrowing === "sector end") keep = (x) => x >= width - n;
  else {
    const gone = new Set<number>();
    const k = width - n;
    for (let i = 0; i < k; i++) gone.add(Math.floor(((i + 0.5) * width) / k));
    keep = (x) => !gone.has(x);
  }
  const out: number[] = [];
  for (let x = width - 1; x >= 0; x--) if (keep(x)) out.push(x);
  return out;
}

/** Name of the stitches of a part that no chart area holds (the thumb gusset, a brim, a hem …). */
function plainAreaName(sizing: SizingResult, piece: string, round: number): string {
  const r = sizing.rows;
  if (sizing.garment === "mitten") return piece === "thumb" ? "thumb" : "thumb gusset";
  if (sizing.garment === "hat") return round < (r.brim ?? 0) ? "brim" : "hat";
  if (piece === "body") return round < (r.hem ?? 0) ? "hem" : "body";
  if (piece === "sleeve") return round < (r.sleeveCuff ?? 0) ? "sleeve cuff" : "sleeve";
  if (piece === "yoke") return round >= (r.yoke ?? 0) - (r.neckband ?? 0) ? "neckband" : "yoke";
  return piece;
}

function needRounds(p: Piece): number[] {
  if (!p.rounds || p.rounds.length === 0) throw new Error(`sizing piece '${p.name}' does not list its rounds`);
  return p.rounds;
}

/** How an area that names no narrowing loses its stitches (the editor's mask uses the same). */
export const DEFAULT_NARROWING: Narrowing = "even";

function chartGeometry(a: ChartArea): { fromRound: number; rowStitches: number[]; narrowing: Narrowing } {
  if (a.fromRound === undefined || !a.rowStitches) throw new Error(`sizing area '${a.area}' does not say where its rounds are`);
  return { fromRound: a.fromRound, rowStitches: a.rowStitches, narrowing: a.narrowing ?? DEFAULT_NARROWING };
}

/** Lays out one tube: every round's spans, areas aligned on an unrolled frame. */
function buildPart(sizing: SizingResult, sp: Piece, partName: string, side: "left" | "right" | null): { part: GarmentPart; areas: GarmentArea[] } {
  const counts = needRounds(sp);
  const charts = sizing.charts.filter((c) => c.piece === sp.name);
  const plainWidth = new Map<string, number>();
  const rounds: GarmentRound[] = [];
  // First pass: spans of each round, without frame positions.
  const raw = counts.map((count, r) => {
    const chartSpans: { area: ChartArea; row: number; n: number }[] = [];
    let covered = 0;
    for (const a of charts) {
      const g = chartGeometry(a);
      const row = r - g.fromRound;
      if (row < 0 || row >= a.height) continue;
      const n = g.rowStitches[row];
      chartSpans.push({ area: a, row, n });
      covered += n * a.repeats;
    }
    const left = count - covered;
    if (left < 0) throw new Error(`sizing: round ${r + 1} of the ${sp.name} has ${count} stitches but its areas hold ${covered}`);
    const plain = left > 0 ? { name: plainAreaName(sizing, sp.name, r), n: left } : null;
    if (plain) plainWidth.set(plain.name, Math.max(plainWidth.get(plain.name) ?? 0, left));
    return { count, chartSpans, plain };
  });
  let frameWidth = 0;
  raw.forEach(({ count, chartSpans, plain }, r) => {
    const spans: RoundSpan[] = [];
    let offset = 0;
    const pushChart = (c: (typeof chartSpans)[number]) => {
      const g = chartGeometry(c.area);
      const columns = inShapeColumns(c.area.width, c.n, g.narrowing);
      for (let rep = 0; rep < c.area.repeats; rep++) {
        spans.push({ area: c.area.area, repeat: rep, row: c.row, columns, frameStart: offset });
        offset += c.area.width;
      }
    };
    const pushPlain = (last: boolean) => {
      if (!plain) return;
      spans.push({ area: plain.name, repeat: 0, row: -1, columns: new Array<number>(plain.n).fill(-1), frameStart: offset });
      offset += last ? plain.n : (plainWidth.get(plain.name) ?? plain.n);
    };
    // The second piece of a pair has its plain stitches (the thumb gusset) at the other edge of
    // the palm: between the first and second area instead of at the end of the round.
    const between = side === "right" && chartSpans.length >= 2;
    chartSpans.forEach((c, i) => {
      pushChart(c);
      if (between && i === 0) pushPlain(false);
    });
    if (!between) pushPlain(true);
    frameWidth = Math.max(frameWidth, offset);
    // the first round shapes when it leaves a different count than the part started on (a yoke's join)
    const before = r > 0 ? counts[r - 1] : sp.castOn > 0 ? sp.castOn : (sizing.counts.yokeJoin ?? count);
    rounds.push({ index: r, stitches: count, shaping: count !== before, spans });
  });

  const areas: GarmentArea[] = charts.map((a) => {
    const g = chartGeometry(a);
    return {
      name: a.area,
      part: partName,
      charted: true,
      width: a.width,
      height: a.height,
      repeats: a.repeats,
      fromRound: g.fromRound,
      rowStitches: g.rowStitches,
      narrowing: g.narrowing,
      stitches: g.rowStitches.reduce((s, n) => s + n, 0) * a.repeats,
    };
  });
  const plainAreas = new Map<string, GarmentArea>();
  raw.forEach(({ plain }, r) => {
    if (!plain) return;
    let a = plainAreas.get(plain.name);
    if (!a) {
      a = { name: plain.name, part: partName, charted: false, width: 0, height: 0, repeats: 1, fromRound: r, rowStitches: [], narrowing: "even", stitches: 0 };
      plainAreas.set(plain.name, a);
    }
    a.width = Math.max(a.width, plain.n);
    a.height += 1;
    a.rowStitches.push(plain.n);
    a.stitches += plain.n;
  });
  return { part: { name: partName, frameWidth, rounds }, areas: [...areas, ...plainAreas.values()] };
}

function pieceNames(name: string, quantity: number): { name: string; side: "left" | "right" | null }[] {
  if (quantity === 1) return [{ name, side: null }];
  if (quantity === 2) return [{ name: `left ${name}`, side: "left" }, { name: `right ${name}`, side: "right" }];
  return Array.from({ length: quantity }, (_, i) => ({ name: `${name} ${i + 1}`, side: null }));
}

/** The garment model of a sizing result. */
export function garmentFromSizing(sizing: SizingResult): Garment {
  const pieces: GarmentPiece[] = [];
  // A mitten's thumb is knitted on that mitten: it is a part of the mitten piece, not a piece of its own.
  const thumb = sizing.garment === "mitten" ? sizing.pieces.find((p) => p.name === "thumb") : undefined;
  for (const sp of sizing.pieces) {
    if (sp === thumb) continue;
    const withThumb = thumb && sp.name === "mitten" ? thumb : undefined;
    if (withThumb && withThumb.quantity !== sp.quantity) throw new Error("sizing: a thumb for every mitten");
    const names = pieceNames(sp.name, sp.quantity);
    names.forEach(({ name, side }, i) => {
      const main = buildPart(sizing, sp, sizing.garment === "mitten" ? "hand" : sp.name, side);
      const parts = [main.part];
      const areas = [...main.areas];
      // Short rows (a back neck raised before the neckband) are rows, not rounds: a part of their own.
      const short = (sp.shortRows ?? []).flatMap((r) => r.stitches);
      if (short.length > 0) {
        const rounds: GarmentRound[] = short.map((n, r) => ({
          index: r,
          stitches: n,
          shaping: false,
          spans: [{ area: "back-neck short rows", repeat: 0, row: -1, columns: new Array<number>(n).fill(-1), frameStart: 0 }],
        }));
        parts.push({ name: "back-neck short rows", frameWidth: Math.max(...short), rounds });
        areas.push({
          name: "back-neck short rows",
          part: "back-neck short rows",
          charted: false,
          width: Math.max(...short),
          height: short.length,
          repeats: 1,
          fromRound: 0,
          rowStitches: short,
          narrowing: "even",
          stitches: short.reduce((a, b) => a + b, 0),
        });
      }
      if (withThumb) {
        const t = buildPart(sizing, withThumb, "thumb", side);
        parts.push(t.part);
        areas.push(...t.areas);
      }
      const stitches = parts.reduce((s, p) => s + p.rounds.reduce((q, r) => q + r.stitches, 0), 0);
      const expected = sp.stitches + (withThumb?.stitches ?? 0);
      if (stitches !== expected) throw new Error(`sizing: the ${name}'s rounds hold ${stitches} stitches, not ${expected}`);
      pieces.push({
        name,
        quantity: 1,
        from: withThumb ? [sp.name, withThumb.name] : [sp.name],
        side,
        pairedWith: names.length === 2 ? names[1 - i].name : null,
        stitches,
        thumbs: withThumb ? 1 : 0,
        castOn: { start: sp.start, stitches: sp.castOn, widthCm: sp.castOnWidthCm },
        bindOff: sp.bindOff,
        parts,
        areas,
      });
    });
  }
  return { kind: sizing.garment, sizing, pieces, chartAreas: sizing.charts.map((c) => c.area) };
}

/** The area a chart may be placed on, or a GarmentError listing the known ones. */
export function findChartArea(garment: Garment, area: string, field: string): ChartArea {
  const found = garment.sizing.charts.find((c) => c.area === area);
  if (!found) {
    throw new GarmentError(field, `no area '${area}' on this ${garment.kind}; its areas are ${garment.chartAreas.map((a) => `'${a}'`).join(", ")}`);
  }
  return found;
}

/**
 * The shape of a chart area as the editor shows it: 1 for a cell knitted as a real stitch, 0 for a
 * cell outside the shape (above a mitten's top decreases, outside a crown sector's narrowing).
 * Cells are row-major from the bottom row, as in a chart.
 */
export function areaShape(garment: Pick<Garment, "sizing" | "chartAreas" | "kind">, area: string): { width: number; height: number; repeats: number; inShape: Uint8Array } {
  const a = findChartArea(garment as Garment, area, "area");
  const g = chartGeometry(a);
  const inShape = new Uint8Array(a.width * a.height);
  for (let y = 0; y < a.height; y++) for (const x of inShapeColumns(a.width, g.rowStitches[y], g.narrowing)) inShape[y * a.width + x] = 1;
  return { width: a.width, height: a.height, repeats: a.repeats, inShape };
}
