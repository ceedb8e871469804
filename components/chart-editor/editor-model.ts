// The editor's working state, kept apart from React so it reads as plain functions.
import {
  commitChart,
  createHistory,
  flipHorizontal,
  mirrorBox,
  parseChart,
  placeLettering,
  serializeChart,
  type Chart,
  type ChartHistory,
  type ChartV1,
  type LetteringPlacement,
} from "@/lib/core/chart";

/** Lettering as stored (colours by palette key), so it survives palette reordering. */
export interface LetteringLayer {
  text: string;
  font: "5x7" | "3x5";
  box: { x: number; y: number; width: number; height: number };
  key: string;
  backgroundKey?: string;
}

export interface StoredEntry {
  area: string;
  label: string;
  chart: unknown;
  lettering?: unknown[];
  options?: Record<string, unknown>;
}

export interface EditorEntry {
  area: string;
  label: string;
  options?: Record<string, unknown>;
  history: ChartHistory;
}

/** Lettering layers belong to a chart value, so undo and redo bring them back with it. */
export type LayerBook = WeakMap<Chart, LetteringLayer[]>;

export function toEditorEntries(stored: StoredEntry[], book: LayerBook): EditorEntry[] {
  return stored.map((s) => {
    const chart = parseChart(s.chart);
    book.set(chart, (s.lettering ?? []) as LetteringLayer[]);
    return { area: s.area, label: s.label, options: s.options, history: createHistory(chart, 200) };
  });
}

export function layersOf(book: LayerBook, chart: Chart): LetteringLayer[] {
  return book.get(chart) ?? [];
}

/** Records an edit; the new chart keeps the layers of the one it came from unless given. */
export function commitEdit(book: LayerBook, entry: EditorEntry, next: Chart, layers?: LetteringLayer[]): EditorEntry {
  if (next === entry.history.present) return entry;
  book.set(next, layers ?? layersOf(book, entry.history.present));
  return { ...entry, history: commitChart(entry.history, next) };
}

export function toStored(book: LayerBook, entries: EditorEntry[]): { area: string; label: string; chart: ChartV1; lettering?: LetteringLayer[]; options?: Record<string, unknown> }[] {
  return entries.map((e) => {
    const chart = e.history.present;
    const layers = layersOf(book, chart).filter((l) => chart.palette.some((c) => c.key === l.key));
    return {
      area: e.area,
      label: e.label,
      chart: serializeChart(chart),
      ...(layers.length ? { lettering: layers } : {}),
      ...(e.options ? { options: e.options } : {}),
    };
  });
}

export function toPlacement(chart: Chart, l: LetteringLayer): LetteringPlacement {
  const colour = chart.palette.findIndex((c) => c.key === l.key);
  const background = l.backgroundKey === undefined ? -1 : chart.palette.findIndex((c) => c.key === l.backgroundKey);
  return { text: l.text, font: l.font, box: { ...l.box }, colour: Math.max(0, colour), ...(background >= 0 ? { background } : {}) };
}

/**
 * The other piece of a pair: the pattern mirrored left to right, each lettering box moved to its
 * mirrored place and its text set afresh there, so words read forwards on both pieces.
 */
export function mirrorForPair(chart: Chart, layers: LetteringLayer[]): { chart: Chart; layers: LetteringLayer[] } {
  let out = flipHorizontal(chart);
  const moved = layers.map((l) => ({ ...l, box: mirrorBox(l.box, chart.width) }));
  for (const l of moved) {
    // A layer with no background leaves mirrored ink behind: clear its own box first with the
    // colour most used around it is guesswork, so layers placed in the editor always carry one.
    out = placeLettering(out, toPlacement(out, l));
  }
  return { chart: out, layers: moved };
}

export function pairArea(area: string): { area: string; suffix: string } {
  if (area.endsWith("-left")) return { area: `${area.slice(0, -5)}-right`, suffix: "right" };
  if (area.endsWith("-right")) return { area: `${area.slice(0, -6)}-left`, suffix: "left" };
  return { area: `${area}-right`, suffix: "right" };
}

const KEYS = "ABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789";

/** The first palette key not yet used. */
export function nextFreeKey(chart: Pick<Chart, "palette">): string {
  for (const k of KEYS) if (!chart.palette.some((c) => c.key === k)) return k;
  return "#";
}

/**
 * Why a motif or pasted block of `size` cannot go with its bottom-left stitch at `at`, or null when
 * it fits. Placements are refused rather than clipped, so no half motif lands on the chart unseen.
 * Stitches are counted from the right and rows from the bottom, as on the chart.
 */
export function offChartProblem(chart: { width: number; height: number }, size: { width: number; height: number }, at: { x: number; y: number }, what: string): string | null {
  const over: string[] = [];
  const left = at.x + size.width - chart.width;
  if (left > 0) over.push(`${left} stitch${left === 1 ? "" : "es"} past the left edge`);
  if (at.x < 0) over.push(`${-at.x} stitch${at.x === -1 ? "" : "es"} past the right edge`);
  const top = at.y + size.height - chart.height;
  if (top > 0) over.push(`${top} row${top === 1 ? "" : "s"} past the top`);
  if (at.y < 0) over.push(`${-at.y} row${at.y === -1 ? "" : "s"} past the bottom`);
  if (!over.length) return null;
  const fits = size.width <= chart.width && size.height <= chart.height;
  return `Not placed: the ${what} (${size.width} × ${size.height}) would reach ${over.join(" and ")}. ${
    fits ? "Click further from the edge: its bottom-left stitch goes where you click." : `It is larger than this ${chart.width} × ${chart.height} chart; choose a smaller one or resize the chart.`
  }`;
}

export const AUTOSAVE_MS = 1200;
/** On a touch screen taps come slower than a mouse drag: wait longer so a burst of taps is one version. */
export const TOUCH_AUTOSAVE_MS = 5000;
/** Unsaved edits never wait longer than this, however the edits keep coming. */
export const AUTOSAVE_MAX_WAIT_MS = 20_000;

/** How long autosave waits after an edit: longer after a tap, never beyond the maximum wait since the first unsaved edit. */
export function autosaveDelay(input: { touch: boolean; dirtySinceMs: number; nowMs: number }): number {
  const quiet = input.touch ? TOUCH_AUTOSAVE_MS : AUTOSAVE_MS;
  const left = input.dirtySinceMs + AUTOSAVE_MAX_WAIT_MS - input.nowMs;
  return Math.max(0, Math.min(quiet, left));
}
