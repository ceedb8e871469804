// Darning one colour of a chart: route, bounds and baseline, and the plan a person reads (trade
// numbering: rows from the bottom, stitches from the right, both from 1).
import type { Chart, TradePosition } from "@/lib/core/chart/model";
import type { CarryGeometry } from "./carry-geometry";
import { getCarryBoundCm, getStitchComponents } from "./darning-bounds";
import { defaultDarningYarn, getDarningMinutes, roundTenth, type DarningRates } from "./darning-rates";
import { getNaiveRoute, type NaiveRoute } from "./naive-route";
import { routeStitchSet, type ColourRoute, type RouteOptions } from "./route-colour";
import { getStitchSet, type StitchSet } from "./stitch-set";

export interface DarningStep extends TradePosition {
  /** yarn carried on the wrong side before this stitch, cm (absent when 0) */
  carryCm?: number;
  /** worked stitches the carry passes behind, in order (absent when it goes straight) */
  via?: TradePosition[];
}

export interface DarningStrand {
  stitches: DarningStep[];
  carryCm: number;
}

export interface ColourDarning {
  key: string;
  name: string;
  stitches: number;
  strands: DarningStrand[];
  ends: number;
  carryCm: number;
  /** stitch loops + tails + carries, cm */
  yarnCm: number;
  minutes: number;
  /** no route can do better than these */
  lowerBound: { ends: number; carryCm: number };
  /** row by row from the bottom, each row from the right, cutting when the next stitch is out of reach */
  naive: { ends: number; carryCm: number; minutes: number };
}

/** The route of one colour before it is written out, with unrounded figures. */
export interface ColourRouting {
  colour: number;
  set: StitchSet;
  route: ColourRoute;
  bound: { ends: number; carryCm: number };
  naive: NaiveRoute;
}

export function routeChartColour(chart: Chart, colour: number, g: CarryGeometry, options?: RouteOptions): ColourRouting {
  const set = getStitchSet(chart, colour, options?.inTheRound ?? false);
  const components = getStitchComponents(set, g);
  const route = routeStitchSet(set, g, options, components);
  return {
    colour,
    set,
    route,
    bound: { ends: 2 * components.count, carryCm: getCarryBoundCm(set, g) },
    naive: getNaiveRoute(set, g),
  };
}

export interface DarningYarn {
  tailCm: number;
  /** length of yarn in one duplicate stitch, cm */
  loopCm: number;
}

/** Yarn in one duplicate stitch ≈ one knitted loop: 4.2 ÷ stitches per cm (fully relaxed Kw ≈ 4.2: Knapton et al. 1968, geometry after Munden 1959). */
export function getLoopLengthCm(stitchesPer10cm: number): number {
  return defaultDarningYarn.loopConstantKw / (stitchesPer10cm / 10);
}

export function describeColourDarning(chart: Chart, r: ColourRouting, yarn: DarningYarn, rates: DarningRates): ColourDarning {
  const { set, route } = r;
  const pos = (id: number): TradePosition => ({ row: set.ys[id] + 1, stitch: chart.width - set.xs[id] });
  const strands: DarningStrand[] = route.strands.map((s) => ({
    stitches: Array.from(s.order, (id, k) => {
      const step: DarningStep = pos(id);
      if (s.carries[k] > 0) step.carryCm = roundHundredth(s.carries[k]);
      const via = s.vias.get(k);
      if (via) step.via = Array.from(via, pos);
      return step;
    }),
    carryCm: roundTenth(s.carryCm),
  }));
  const colour = chart.palette[r.colour];
  return {
    key: colour.key,
    name: colour.name,
    stitches: set.n,
    strands,
    ends: route.ends,
    carryCm: roundTenth(route.carryCm),
    yarnCm: Math.round(set.n * yarn.loopCm + route.ends * yarn.tailCm + route.carryCm),
    minutes: roundTenth(getDarningMinutes({ stitches: set.n, ends: route.ends, carryCm: route.carryCm }, rates)),
    lowerBound: { ends: r.bound.ends, carryCm: roundTenth(r.bound.carryCm) },
    naive: {
      ends: r.naive.ends,
      carryCm: roundTenth(r.naive.carryCm),
      minutes: roundTenth(getDarningMinutes({ stitches: set.n, ends: r.naive.ends, carryCm: r.naive.carryCm }, rates)),
    },
  };
}

function roundHundredth(v: number): number {
  return Math.round(v * 100) / 100;
}
