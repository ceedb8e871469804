// Times the round-by-round pair planner on pieces of garment size: a mitten hand (64 stitches ×
// 70 rounds, 4 colours), a yoke (240 → 96 stitches over 60 rounds, 6 colours) and a hat (112 × 60,
// 16 colours: the largest state space). Prints milliseconds and the plan's figures; no assertions.
// "planned" minutes use the estimated route (what the planner minimises, comparable with the single
// pair); "routed" minutes use the real route of the chosen plan and staggered catches.
import { readFileSync } from "node:fs";
import { parseChart } from "@/lib/core/chart/format";
import { planColours } from "@/lib/core/colourwork/colour-plan";
import { planRoundPairs } from "@/lib/core/colourwork/round-pairs";

const HEXES = ["#F2EAD3", "#1F2A44", "#B3282D", "#D9A441", "#2E6B3F", "#7A4E9C", "#E07B39", "#4FA3C7", "#222222", "#AAAAAA", "#F5C6D6", "#5B3A29", "#C9D66B", "#0E4D64", "#FFFFFF", "#8C1C13"];

function piece(name: string, lengths: number[], colours: number, seed: number) {
  let s = seed;
  const rnd = () => ((s = (Math.imul(s, 1103515245) + 12345) >>> 0) / 2 ** 32);
  // bands of motifs: a main colour, a contrast per band, an accent now and then
  const rounds = lengths.map((n, r) => {
    const band = Math.floor(r / 8);
    const contrast = 1 + (band % (colours - 1));
    const accent = 1 + ((band + 1) % (colours - 1));
    return Array.from({ length: n }, (_, k) => {
      const motif = (k + r) % 6 < 2 || (k - r + 60) % 7 === 0;
      if (!motif) return 0;
      return rnd() < 0.12 ? accent : contrast;
    });
  });
  return { name, input: { rounds, palette: HEXES.slice(0, colours).map((hex, i) => ({ key: String.fromCharCode(65 + i), hex })), gauge: { stitchesPer10cm: 28, rowsPer10cm: 32 } } };
}

const pieces = [
  piece("mitten hand 64 × 70, 4 colours", Array.from({ length: 70 }, (_, r) => (r < 56 ? 64 : 64 - 4 * (r - 55))), 4, 1),
  piece("yoke 240 → 96 × 60, 6 colours", Array.from({ length: 60 }, (_, r) => 240 - 24 * Math.floor(r / 10)), 6, 2),
  piece("hat 112 × 60, 16 colours", Array.from({ length: 60 }, () => 112), 16, 3),
];
planRoundPairs(pieces[0].input); // warm up: the first call also compiles
for (const p of pieces) {
  const t0 = performance.now();
  const plan = planRoundPairs(p.input);
  const ms = performance.now() - t0;
  const changes = plan.rounds.filter((r) => r.joined.length > 0).length;
  console.log(
    `${p.name}: ${ms.toFixed(0)} ms; ${plan.totals.darnedStitches} darned, ${changes} rounds where the pair changes, ` +
      `${plan.plannedMinutes} min planned (${plan.totals.minutes} routed); best single pair ${plan.singlePair?.minutes} min (keeps rules: ${plan.singlePair?.keepsRules})`,
  );
}

// The fixture charts read as whole rounds (top row last): darned stitches with one pair for the
// whole chart (the old model, planColours) against pairs chosen round by round.
for (const name of ["hat-band", "mitten-left", "peerie-band"]) {
  const chart = parseChart(JSON.parse(readFileSync(`tests/fixtures/charts/${name}.json`, "utf8")));
  const old = planColours(chart);
  const rounds = Array.from({ length: chart.height }, (_, y) => Array.from({ length: chart.width }, (_, k) => chart.cells[y * chart.width + (chart.width - 1 - k)]));
  const twoColourDarned = rounds.reduce((sum, round) => {
    const present = new Set(round);
    if (present.size > 2) return sum;
    return sum + round.filter((c) => !old.knit.includes(chart.palette[c].key)).length;
  }, 0);
  const t0 = performance.now();
  const plan = planRoundPairs({ rounds, palette: chart.palette, gauge: chart.gauge });
  const ms = performance.now() - t0;
  console.log(
    `${name} (${chart.width} × ${chart.height}, ${chart.palette.length} colours): one pair ${old.knit.join("")} darns ${old.darnedStitches} ` +
      `(${twoColourDarned} in rounds of two colours); round by round darns ${plan.totals.darnedStitches}, ` +
      `${plan.rounds.filter((r) => r.joined.length > 0).length - 1} pair changes, ${plan.plannedMinutes} min planned against ${plan.singlePair?.minutes} min ` +
      `for the best single pair (keeps rules: ${plan.singlePair?.keepsRules}), ${plan.totals.minutes} min routed; ${ms.toFixed(0)} ms`,
  );
}
