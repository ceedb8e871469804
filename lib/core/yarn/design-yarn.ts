// Yarn for a whole design, per studio yarn: each chart's colours are matched to the studio's yarn
// records by colour, their lengths summed over every chart (and the garment's plain parts), and only
// then turned into skeins, so a pair of mittens shares its skeins instead of rounding up twice.
import type { Chart, PaletteColour } from "../chart/model";
import { ALLOWANCE_SOURCES, DEFAULT_MARGIN_PERCENT } from "./allowances";
import { estimateChartYarn } from "./chart-yarn";
import type { DarningPlanData } from "./darning-plan";
import type { PlainYarnEstimate } from "./garment-yarn";
import type { YarnReading } from "../garment/types";
import { MUNDEN_SOURCE } from "./loop-length";
import { METRES_PER_YARD, getSkeinNeed, type SkeinNeed } from "./skeins";

/** A yarn the studio stocks, as the design estimate reads it. */
export interface StudioYarnRecord {
  id: string;
  name: string;
  colourName: string;
  hex: string;
  metresPerSkein: number;
  gramsPerSkein: number;
  /** skeins free to use, by dye lot; left out when stock is not recorded */
  lots?: { lot: string; skeins: number }[];
}

export interface DesignChartYarnInput {
  label: string;
  chart: Pick<Chart, "width" | "height" | "gauge" | "palette" | "cells">;
  /** the darning plan (plan-darning output), or null when nothing is darned */
  plan: DarningPlanData | null;
  /** the knitted pair the colour plan chose */
  knit?: string[];
}

export interface DesignYarnLine {
  /** the matched studio yarn, or null when no studio yarn has this colour */
  yarnId: string | null;
  label: string;
  hex: string;
  roles: ("knitted" | "darned")[];
  /** labels of the charts (and "plain parts") that use it */
  uses: string[];
  /** rounded up to the cm, margin included */
  totalCm: number;
  /** rounded up to 0.1 */
  metres: number;
  yards: number;
  skeins: SkeinNeed | null;
}

export interface DesignYarnEstimate {
  marginPercent: number;
  /** longest first */
  lines: DesignYarnLine[];
  totals: { metres: number; yards: number };
  warnings: string[];
  sources: string[];
}

export interface DesignYarnOptions {
  marginPercent?: number;
  tailCm?: number;
  coverageFactor?: number;
}

const norm = (hex: string) => hex.trim().toLowerCase();
const ceilTenth = (v: number) => Math.ceil(v * 10 - 1e-9) / 10;

/**
 * The studio yarn a palette colour stands for: same hex (case ignored); where several yarns share
 * it, the one whose colour name is the palette colour's name, else the first listed.
 */
export function matchStudioYarn(colour: Pick<PaletteColour, "name" | "hex">, yarns: StudioYarnRecord[]): StudioYarnRecord | null {
  const same = yarns.filter((y) => norm(y.hex) === norm(colour.hex));
  if (same.length === 0) return null;
  const name = colour.name.trim().toLowerCase();
  return same.find((y) => y.colourName.trim().toLowerCase() === name) ?? same[0];
}

export function estimateDesignYarn(args: {
  charts: DesignChartYarnInput[];
  yarns: StudioYarnRecord[];
  /** the garment's plain parts, knitted in the first chart's main colour */
  plain?: PlainYarnEstimate | null;
  options?: DesignYarnOptions;
}): DesignYarnEstimate {
  const margin = args.options?.marginPercent ?? DEFAULT_MARGIN_PERCENT;
  if (!(margin >= 0 && margin <= 100)) throw new Error(`marginPercent must be between 0 and 100 (got ${margin})`);
  const warnings: string[] = [];
  const { add, finish } = yarnGroups(args.yarns, margin, warnings);

  args.charts.forEach((entry, i) => {
    // The plain parts carry the cast-on when they are counted; otherwise each chart allows for one.
    const est = estimateChartYarn(entry.chart, entry.plan, {
      ...(entry.knit ? { knit: entry.knit } : {}),
      ...(args.options?.tailCm !== undefined ? { tailCm: args.options.tailCm } : {}),
      ...(args.options?.coverageFactor !== undefined ? { coverageFactor: args.options.coverageFactor } : {}),
      castOn: !args.plain,
    });
    for (const w of est.warnings) warnings.push(`${entry.label}: ${w}`);
    for (const c of est.colours) {
      const colour = entry.chart.palette.find((p) => p.key === c.key);
      if (!colour) continue;
      const cm = c.cm.knitted + c.cm.floats + c.cm.darned + c.cm.tails + c.cm.carries + c.cm.castOn + c.cm.bindOff;
      if (cm > 0) add(colour, c.role, entry.label, cm);
    }
    if (i === 0 && args.plain && args.plain.totalCm > 0) {
      const main = entry.chart.palette.find((p) => p.key === est.knit[0]);
      if (main) add(main, "knitted", "plain parts", args.plain.totalCm);
    }
  });

  return finish([MUNDEN_SOURCE, ALLOWANCE_SOURCES.longTail, ALLOWANCE_SOURCES.coverage, ALLOWANCE_SOURCES.tail, ALLOWANCE_SOURCES.margin]);
}

/**
 * Yarn for a whole garment from its reading (lib/core/garment: every stitch of every piece once,
 * darned stitches over their real underlay, tails, carries, cast-on and bind-off per colour),
 * matched to the studio's yarns by colour, with the margin and skeins worked once per yarn.
 */
export function estimateGarmentYarn(args: { yarn: YarnReading; yarns: StudioYarnRecord[]; pieces?: string[]; options?: Pick<DesignYarnOptions, "marginPercent"> }): DesignYarnEstimate {
  const margin = args.options?.marginPercent ?? DEFAULT_MARGIN_PERCENT;
  if (!(margin >= 0 && margin <= 100)) throw new Error(`marginPercent must be between 0 and 100 (got ${margin})`);
  const warnings: string[] = [];
  const { add, finish } = yarnGroups(args.yarns, margin, warnings);
  const use = args.pieces?.length ? args.pieces.join(", ") : "the garment";
  for (const c of args.yarn.colours) {
    // A colour that is only darned has its tails with the darning; carries always are.
    const knitted = c.knittedStitches > 0 ? c.cm.knitted + c.cm.floats + c.cm.tails + c.cm.castOn + c.cm.bindOff : 0;
    const darned = c.cm.darned + c.cm.carries + (c.knittedStitches > 0 ? 0 : c.cm.tails);
    if (knitted > 0) add(c, "knitted", use, knitted);
    if (darned > 0) add(c, "darned", use, darned);
  }
  return finish([...args.yarn.sources, ALLOWANCE_SOURCES.margin]);
}

/** Lengths grouped per studio yarn (or per colour no studio yarn has), then margin and skeins once per group. */
function yarnGroups(yarns: StudioYarnRecord[], margin: number, warnings: string[]) {
  const groups = new Map<string, { yarn: StudioYarnRecord | null; label: string; hex: string; roles: Set<"knitted" | "darned">; uses: Set<string>; cm: number }>();
  const add = (colour: Pick<PaletteColour, "name" | "hex">, role: "knitted" | "darned", use: string, cm: number) => {
    const yarn = matchStudioYarn(colour, yarns);
    const key = yarn ? `yarn:${yarn.id}` : `colour:${norm(colour.hex)}|${colour.name}`;
    let g = groups.get(key);
    if (!g) {
      g = { yarn, label: yarn ? `${yarn.name}, ${yarn.colourName}` : colour.name, hex: yarn?.hex ?? colour.hex, roles: new Set(), uses: new Set(), cm: 0 };
      groups.set(key, g);
    }
    g.roles.add(role);
    g.uses.add(use);
    g.cm += cm;
  };
  const finish = (sources: string[]): DesignYarnEstimate => {
    const lines = [...groups.values()]
      .map((g): DesignYarnLine => {
        const totalCm = Math.ceil(g.cm * (1 + margin / 100) - 1e-9);
        if (!g.yarn) warnings.push(`no studio yarn has the colour ${g.label} (${g.hex}): metres only; add the yarn or pick one of the studio's yarns in the chart's palette`);
        const skeins = g.yarn
          ? getSkeinNeed(totalCm, { key: g.yarn.id, name: g.label, metresPerSkein: g.yarn.metresPerSkein, gramsPerSkein: g.yarn.gramsPerSkein, lots: g.yarn.lots })
          : null;
        if (skeins?.note) warnings.push(skeins.note);
        return {
          yarnId: g.yarn?.id ?? null,
          label: g.label,
          hex: g.hex,
          roles: [...g.roles].sort(),
          uses: [...g.uses],
          totalCm,
          metres: ceilTenth(totalCm / 100),
          yards: ceilTenth(totalCm / 100 / METRES_PER_YARD),
          skeins,
        };
      })
      .sort((a, b) => b.totalCm - a.totalCm || a.label.localeCompare(b.label));
    const totalCm = lines.reduce((s, l) => s + l.totalCm, 0);
    return {
      marginPercent: margin,
      lines,
      totals: { metres: ceilTenth(totalCm / 100), yards: ceilTenth(totalCm / 100 / METRES_PER_YARD) },
      warnings,
      sources,
    };
  };
  return { add, finish };
}
