// The darning plan of a chart: for each darned colour, the needle's way through all its stitches
// (one strand per group of stitches within reach of each other), with ends, carried yarn, yarn
// used, minutes, the lower bounds and the row-by-row baseline for comparison.
import type { Chart } from "@/lib/core/chart/model";
import { getCarryGeometry } from "./carry-geometry";
import { buildColourPlan, type RoutingCache } from "./colour-plan";
import { resolveDarningOptions } from "./colourwork-options";
import { describeColourDarning, getLoopLengthCm, routeChartColour, type ColourDarning } from "./darn-colour";
import { getDarningMinutes, getOverheadMinutes, roundTenth, type DarningRates } from "./darning-rates";

export interface DarningTotals {
  stitches: number;
  strands: number;
  ends: number;
  carryCm: number;
  yarnCm: number;
  minutes: number;
  lowerBound: { ends: number; carryCm: number };
  naive: { ends: number; carryCm: number; minutes: number };
  /** ends and minutes saved against darning row by row */
  saved: { ends: number; minutes: number };
}

export interface DarningPlan {
  /** the knitted pair, when the colour plan chose what to darn */
  knit?: string[];
  colours: ColourDarning[];
  totals: DarningTotals;
  settings: { carryLimitCm: number; tailCm: number; loopCm: number; rates: DarningRates; routeInTheRound: boolean };
}

export function planDarning(chart: Chart, options: unknown = {}): DarningPlan {
  const o = resolveDarningOptions(chart, options);
  const cache: RoutingCache = new Map();
  let darn = o.darn;
  let knit: string[] | undefined;
  if (!darn) {
    const chosen = buildColourPlan(chart, o, cache);
    darn = chosen.darn;
    knit = chosen.plan.knit;
  }
  const g = getCarryGeometry(chart.gauge, o.carryLimitCm);
  const loopCm = getLoopLengthCm(chart.gauge.stitchesPer10cm);
  const yarn = { tailCm: o.tailCm, loopCm };
  const raw = { stitches: 0, strands: 0, ends: 0, carryCm: 0, yarnCm: 0, boundEnds: 0, boundCarry: 0, naiveEnds: 0, naiveCarry: 0 };
  const colours = darn.map((c) => {
    const r = cache.get(c) ?? routeChartColour(chart, c, g, { inTheRound: o.routeInTheRound });
    raw.stitches += r.set.n;
    raw.strands += r.route.strands.length;
    raw.ends += r.route.ends;
    raw.carryCm += r.route.carryCm;
    raw.boundEnds += r.bound.ends;
    raw.boundCarry += r.bound.carryCm;
    raw.naiveEnds += r.naive.ends;
    raw.naiveCarry += r.naive.carryCm;
    return describeColourDarning(chart, r, yarn, o.rates);
  });
  const minutes = getDarningMinutes({ stitches: raw.stitches, ends: raw.ends, carryCm: raw.carryCm }, o.rates);
  const naiveMinutes = getDarningMinutes({ stitches: raw.stitches, ends: raw.naiveEnds, carryCm: raw.naiveCarry }, o.rates);
  const plan: DarningPlan = {
    ...(knit ? { knit } : {}),
    colours,
    totals: {
      stitches: raw.stitches,
      strands: raw.strands,
      ends: raw.ends,
      carryCm: roundTenth(raw.carryCm),
      yarnCm: Math.round(raw.stitches * loopCm + raw.ends * o.tailCm + raw.carryCm),
      minutes: roundTenth(minutes),
      lowerBound: { ends: raw.boundEnds, carryCm: roundTenth(raw.boundCarry) },
      naive: { ends: raw.naiveEnds, carryCm: roundTenth(raw.naiveCarry), minutes: roundTenth(naiveMinutes) },
      saved: {
        ends: raw.naiveEnds - raw.ends,
        minutes: roundTenth(
          getOverheadMinutes({ ends: raw.naiveEnds, carryCm: raw.naiveCarry }, o.rates) -
            getOverheadMinutes({ ends: raw.ends, carryCm: raw.carryCm }, o.rates),
        ),
      },
    },
    settings: { carryLimitCm: o.carryLimitCm, tailCm: o.tailCm, loopCm: roundTenth(loopCm), rates: o.rates, routeInTheRound: o.routeInTheRound },
  };
  return plan;
}
