// Test helpers: charts in exchange format for a garment's areas, drawn by a function of the cell
// (x from the left, y from the bottom, both from 0) and whether the cell is a real stitch.
import { inShapeColumns } from "@/lib/core/garment/build-garment";
import type { ChartArea, SizingResult } from "@/lib/core/sizing/sizing-result";

export const PALETTE = [
  { key: "A", name: "Oat", hex: "#EFE6D2" },
  { key: "B", name: "Rowan red", hex: "#9E2B25" },
  { key: "C", name: "Gold", hex: "#D9A441" },
  { key: "D", name: "Navy", hex: "#1F2A44" },
];

export function area(sizing: SizingResult, name: string): ChartArea {
  const a = sizing.charts.find((c) => c.area === name);
  if (!a) throw new Error(`no area ${name}`);
  return a;
}

/** Whether cell (x, y) of an area's chart is a real stitch. */
export function inShape(a: ChartArea, x: number, y: number): boolean {
  return inShapeColumns(a.width, a.rowStitches![y], a.narrowing ?? "even").includes(x);
}

export function chartV1(a: ChartArea, fill: (x: number, y: number, inside: boolean) => string, sizing: SizingResult, palette = PALETTE) {
  const rows: string[] = [];
  for (let y = a.height - 1; y >= 0; y--) {
    const inside = new Set(inShapeColumns(a.width, a.rowStitches![y], a.narrowing ?? "even"));
    let t = "";
    for (let x = 0; x < a.width; x++) t += fill(x, y, inside.has(x));
    rows.push(t);
  }
  return {
    version: 1,
    width: a.width,
    height: a.height,
    gauge: { stitchesPer10cm: sizing.gauge.stitchesPer10cm, rowsPer10cm: sizing.gauge.rowsPer10cm },
    palette,
    rows,
  };
}

/** Outside cells are left in the first colour, as the editor leaves them. */
export const only = (f: (x: number, y: number) => string) => (x: number, y: number, inside: boolean) => (inside ? f(x, y) : "A");

export interface VerbPiece {
  name: string;
  quantity: number;
  stitches: number;
  features: {
    newDesign: boolean;
    proofRounds: number;
    plainStitches: number;
    strandedStitches: number;
    floatCatches: number;
    shapingRounds: number;
    thumbs: number;
    duplicateStitches: number;
    ends: number;
    carryCm: number;
  };
}

export interface VerbOutput {
  pieces: VerbPiece[];
  rounds: { piece: string; part: string; round: number; stitches: number; knit: string[]; darned: number }[];
  yarn: { colours: { key: string; knittedStitches: number; darnedStitches: number; metres: number }[]; totals: { metres: number } };
  labour: { stages: Record<string, { p50Minutes: number; p80Minutes: number }>; pieces: { label?: string }[] };
}

/** The size verb's count for the garment: pieces[].stitches × quantity. */
export function sizeTotal(sizing: SizingResult): number {
  return sizing.pieces.reduce((s, p) => s + p.stitches * p.quantity, 0);
}
