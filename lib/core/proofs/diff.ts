// What changed between two proofs: per chart, the stitches whose colour changed and the colours
// that appear or disappear. Colours are compared by their hex value, so a reordered palette or a
// renamed colour is not a change in the knitting.
import type { Chart, TradePosition } from "../chart/model";

export interface ChartDiff {
  area: string;
  label: string;
  status: "added" | "removed" | "changed" | "same";
  sizeChanged: boolean;
  /** stitches whose colour differs (a stitch present in only one of the two counts as changed) */
  cellsChanged: number;
  /** up to `sampleLimit` changed stitches in trade numbering, for pointing at them */
  sample: TradePosition[];
  coloursAdded: string[];
  coloursRemoved: string[];
}

export interface NamedChart {
  area: string;
  label: string;
  chart: Chart;
}

function usedColours(chart: Chart): Map<string, string> {
  const used = new Set<number>(chart.cells);
  const out = new Map<string, string>();
  for (const i of used) out.set(chart.palette[i].hex.toUpperCase(), chart.palette[i].name);
  return out;
}

function hexAt(chart: Chart, x: number, y: number): string | null {
  if (x < 0 || y < 0 || x >= chart.width || y >= chart.height) return null;
  return chart.palette[chart.cells[y * chart.width + x]].hex.toUpperCase();
}

/** Compares two charts cell by cell, aligned at the bottom-right (where trade numbering starts). */
export function diffChart(before: Chart, after: Chart, sampleLimit = 20): Omit<ChartDiff, "area" | "label" | "status"> {
  const width = Math.max(before.width, after.width);
  const height = Math.max(before.height, after.height);
  let cellsChanged = 0;
  const sample: TradePosition[] = [];
  for (let y = 0; y < height; y++) {
    for (let s = 1; s <= width; s++) {
      const a = hexAt(before, before.width - s, y);
      const b = hexAt(after, after.width - s, y);
      if (a !== b) {
        cellsChanged++;
        if (sample.length < sampleLimit) sample.push({ row: y + 1, stitch: s });
      }
    }
  }
  const ca = usedColours(before);
  const cb = usedColours(after);
  return {
    sizeChanged: before.width !== after.width || before.height !== after.height,
    cellsChanged,
    sample,
    coloursAdded: [...cb].filter(([hex]) => !ca.has(hex)).map(([, name]) => name),
    coloursRemoved: [...ca].filter(([hex]) => !cb.has(hex)).map(([, name]) => name),
  };
}

/** Matches charts by area and compares each; charts only on one side are added or removed. */
export function diffProofCharts(before: readonly NamedChart[], after: readonly NamedChart[]): ChartDiff[] {
  const out: ChartDiff[] = [];
  const prev = new Map(before.map((c) => [c.area, c]));
  for (const n of after) {
    const p = prev.get(n.area);
    if (!p) {
      const colours = [...usedColours(n.chart).values()];
      out.push({ area: n.area, label: n.label, status: "added", sizeChanged: true, cellsChanged: n.chart.width * n.chart.height, sample: [], coloursAdded: colours, coloursRemoved: [] });
      continue;
    }
    prev.delete(n.area);
    const d = diffChart(p.chart, n.chart);
    const same = d.cellsChanged === 0 && !d.sizeChanged;
    out.push({ area: n.area, label: n.label, status: same ? "same" : "changed", ...d });
  }
  for (const p of prev.values()) {
    out.push({ area: p.area, label: p.label, status: "removed", sizeChanged: true, cellsChanged: p.chart.width * p.chart.height, sample: [], coloursAdded: [], coloursRemoved: [...usedColours(p.chart).values()] });
  }
  return out;
}

/** One line per chart for people: "Left mitten: 6 stitches changed; colours added: Gorse." */
export function describeDiff(d: ChartDiff): string {
  if (d.status === "added") return `${d.label}: new in this proof.`;
  if (d.status === "removed") return `${d.label}: no longer in this proof.`;
  if (d.status === "same") return `${d.label}: no change.`;
  const parts = [`${d.cellsChanged} stitch${d.cellsChanged === 1 ? "" : "es"} changed`];
  if (d.sizeChanged) parts.push("size changed");
  if (d.coloursAdded.length) parts.push(`colours added: ${d.coloursAdded.join(", ")}`);
  if (d.coloursRemoved.length) parts.push(`colours no longer used: ${d.coloursRemoved.join(", ")}`);
  return `${d.label}: ${parts.join("; ")}.`;
}
