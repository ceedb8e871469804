// Yarn per colour for one chart: knitted stitches, floats carried behind stranded rows, darned
// stitches, ends, carries between darned areas, cast-on and bind-off. Lengths in cm, unrounded.
import type { Chart } from "../chart/model";
import {
  DEFAULT_COVERAGE_FACTOR,
  DEFAULT_TAIL_CM,
  getBindOffCm,
  getCastOnCm,
} from "./allowances";
import type { DarningPlanData } from "./darning-plan";
import { getLoopLengthCm, getStitchWidthCm } from "./loop-length";

export interface ChartYarnOptions {
  /** the two colours knitted in stranded work (keys); default the plan's pair, else the two most-used colours */
  knit?: string[];
  /** knitted colour under each darned colour (key → key); default the plan's, else the main colour */
  underlay?: Record<string, string>;
  /** "round": a colour is carried all around a round it appears in; "span": only between its first and last stitch */
  carry?: "round" | "span";
  coverageFactor?: number;
  tailCm?: number;
  /** how many times the chart is knitted (2 for a pair of mittens) */
  quantity?: number;
  /** allow for a long-tail cast-on in the main colour (default true) */
  castOn?: boolean;
  /** allow for a bind-off in the main colour (default false: hats and mittens are drawn together) */
  bindOff?: boolean;
}

export interface ColourYarn {
  key: string;
  name: string;
  role: "knitted" | "darned";
  /** chart cells in this colour (one chart) */
  cells: number;
  /** stitches knitted in this colour, underlay included (one chart) */
  knittedStitches: number;
  /** stitches darned in this colour (one chart) */
  darnedStitches: number;
  /** ends to weave in (one chart) */
  ends: number;
  /** lengths in cm for all `quantity` charts */
  cm: { knitted: number; floats: number; darned: number; tails: number; carries: number; castOn: number; bindOff: number };
}

export interface ChartYarnEstimate {
  loopLengthCm: number;
  stitchWidthCm: number;
  knit: string[];
  quantity: number;
  colours: ColourYarn[];
  warnings: string[];
}

type ChartCells = Pick<Chart, "width" | "height" | "gauge" | "palette" | "cells">;

/** Areas of one colour, stitches touching at a side or a corner (darning may run diagonally). */
export function countAreas(chart: Pick<Chart, "width" | "height" | "cells">, colour: number): number {
  const { width, height, cells } = chart;
  const seen = new Uint8Array(width * height);
  let areas = 0;
  const stack: number[] = [];
  for (let start = 0; start < cells.length; start++) {
    if (cells[start] !== colour || seen[start]) continue;
    areas += 1;
    seen[start] = 1;
    stack.push(start);
    while (stack.length) {
      const i = stack.pop() as number;
      const x = i % width;
      const y = (i - x) / width;
      for (let dy = -1; dy <= 1; dy++) {
        for (let dx = -1; dx <= 1; dx++) {
          const nx = x + dx;
          const ny = y + dy;
          if (nx < 0 || ny < 0 || nx >= width || ny >= height) continue;
          const j = ny * width + nx;
          if (!seen[j] && cells[j] === colour) {
            seen[j] = 1;
            stack.push(j);
          }
        }
      }
    }
  }
  return areas;
}

function keyIndex(chart: ChartCells, key: string, field: string): number {
  const i = chart.palette.findIndex((p) => p.key === key);
  if (i < 0) throw new Error(`${field}: colour '${key}' is not in the chart's palette (${chart.palette.map((p) => p.key).join(", ")})`);
  return i;
}

export function estimateChartYarn(chart: ChartCells, plan: DarningPlanData | null, options: ChartYarnOptions = {}): ChartYarnEstimate {
  const { width, height, cells, palette } = chart;
  const warnings: string[] = [];
  const loop = getLoopLengthCm(chart.gauge.stitchesPer10cm);
  const stitchW = getStitchWidthCm(chart.gauge.stitchesPer10cm);
  const quantity = options.quantity ?? 1;
  const tailCm = options.tailCm ?? DEFAULT_TAIL_CM;
  const coverage = options.coverageFactor ?? DEFAULT_COVERAGE_FACTOR;
  if (!(quantity >= 1) || !Number.isInteger(quantity)) throw new Error(`quantity must be a whole number, at least 1 (got ${quantity})`);
  if (!(tailCm >= 0)) throw new Error(`tailCm must be 0 or more (got ${tailCm})`);
  if (!(coverage >= 1)) throw new Error(`coverageFactor must be at least 1 (got ${coverage})`);

  const counts = new Array<number>(palette.length).fill(0);
  for (const c of cells) counts[c] += 1;
  const used = palette.map((_, i) => i).filter((i) => counts[i] > 0);

  // The knitted pair: given, or the two most-used colours (a tie goes to the earlier palette entry).
  let knit: number[];
  const chosenKnit = options.knit && options.knit.length > 0 ? { keys: options.knit, field: "knit" } : plan?.knit ? { keys: plan.knit, field: "plan.knit" } : null;
  if (chosenKnit) {
    const { keys, field } = chosenKnit;
    if (keys.length > 2) throw new Error(`${field}: stranded work knits two colours at most (got ${keys.length})`);
    knit = keys.map((k) => keyIndex(chart, k, field));
    if (knit.length === 2 && knit[0] === knit[1]) throw new Error(`${field}: the two knitted colours must differ (got '${keys[0]}' twice)`);
    knit.sort((a, b) => counts[b] - counts[a] || a - b);
  } else {
    knit = [...used].sort((a, b) => counts[b] - counts[a] || a - b).slice(0, 2);
  }
  const main = knit[0];

  const planByKey = new Map((plan?.colours ?? []).map((c) => [c.key, c]));
  const underlayOf = new Array<number>(palette.length).fill(-1);
  for (const i of used) {
    if (knit.includes(i)) continue;
    const key = palette[i].key;
    const chosen = options.underlay?.[key] ?? planByKey.get(key)?.underlay;
    if (chosen === undefined) {
      underlayOf[i] = main;
      continue;
    }
    const u = keyIndex(chart, chosen, `underlay for '${key}'`);
    if (!knit.includes(u)) {
      throw new Error(`underlay for '${key}': '${chosen}' is not one of the knitted colours (${knit.map((k) => palette[k].key).join(", ")})`);
    }
    underlayOf[i] = u;
  }

  // Knitted stitches and floats, row by row.
  const knitted = new Array<number>(palette.length).fill(0);
  const floatStitches = new Array<number>(palette.length).fill(0);
  const rowCount = new Array<number>(palette.length);
  const first = new Array<number>(palette.length);
  const last = new Array<number>(palette.length);
  for (let y = 0; y < height; y++) {
    rowCount.fill(0);
    first.fill(-1);
    last.fill(-1);
    for (let x = 0; x < width; x++) {
      const c = cells[y * width + x];
      const k = underlayOf[c] >= 0 ? underlayOf[c] : c;
      rowCount[k] += 1;
      if (first[k] < 0) first[k] = x;
      last[k] = x;
    }
    for (const k of knit) {
      if (rowCount[k] === 0) continue;
      knitted[k] += rowCount[k];
      const span = options.carry === "span" ? last[k] - first[k] + 1 : width;
      floatStitches[k] += span - rowCount[k];
    }
  }

  const castOnCm = options.castOn === false ? 0 : getCastOnCm(width * stitchW);
  const bindOffCm = options.bindOff ? getBindOffCm(width * stitchW) : 0;
  const colours: ColourYarn[] = [];
  for (const i of used) {
    const p = palette[i];
    if (knit.includes(i)) {
      const ends = 2; // joined at the start, cut at the end
      colours.push({
        key: p.key,
        name: p.name,
        role: "knitted",
        cells: counts[i],
        knittedStitches: knitted[i],
        darnedStitches: 0,
        ends,
        cm: {
          knitted: quantity * knitted[i] * loop,
          floats: quantity * floatStitches[i] * stitchW,
          darned: 0,
          tails: quantity * ends * tailCm,
          carries: 0,
          castOn: i === main ? quantity * castOnCm : 0,
          bindOff: i === main ? quantity * bindOffCm : 0,
        },
      });
      if (planByKey.has(p.key)) warnings.push(`the darning plan lists '${p.key}', which is knitted here; its plan entry is not counted`);
      continue;
    }
    const planned = planByKey.get(p.key);
    let ends: number;
    let carries = 0;
    if (planned) {
      ends = planned.ends;
      carries = planned.carryCm;
      if (planned.stitches !== counts[i]) {
        warnings.push(`the darning plan has ${planned.stitches} stitches of '${p.key}' but the chart has ${counts[i]}; the chart's count is used`);
      }
    } else {
      ends = 2 * countAreas(chart, i);
      if (plan) warnings.push(`the darning plan has no route for '${p.key}': its ends are estimated as 2 for each area`);
    }
    colours.push({
      key: p.key,
      name: p.name,
      role: "darned",
      cells: counts[i],
      knittedStitches: 0,
      darnedStitches: counts[i],
      ends,
      cm: {
        knitted: 0,
        floats: 0,
        darned: quantity * counts[i] * loop * coverage,
        tails: quantity * ends * tailCm,
        carries: quantity * carries,
        castOn: 0,
        bindOff: 0,
      },
    });
  }
  for (const c of plan?.colours ?? []) {
    if (!palette.some((p) => p.key === c.key)) warnings.push(`the darning plan names '${c.key}', which is not in the chart's palette`);
    else if (counts[palette.findIndex((p) => p.key === c.key)] === 0) warnings.push(`the darning plan names '${c.key}', which no stitch of the chart uses`);
  }
  // Knitted pair first, then darned colours in palette order.
  const order = (c: ColourYarn) => {
    const i = palette.findIndex((p) => p.key === c.key);
    return knit.includes(i) ? knit.indexOf(i) : 2 + i;
  };
  colours.sort((a, b) => order(a) - order(b));
  return { loopLengthCm: loop, stitchWidthCm: stitchW, knit: knit.map((k) => palette[k].key), quantity, colours, warnings };
}
