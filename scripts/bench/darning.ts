// Darning-route benchmark: `npm run bench:darning`. A fixed corpus generated from a seeded PRNG
// (small motifs, lettering, a mitten back, a sweater yoke, scattered dots, large solid areas);
// one JSON line per case, then a summary line comparing the routes with the lower bounds and with
// darning row by row.
import { createChart, type Chart, type Gauge } from "@/lib/core/chart/model";
import { planDarning } from "@/lib/core/colourwork/darning-plan";
import { defaultDarningRates, getOverheadMinutes } from "@/lib/core/colourwork/darning-rates";

function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const PALETTE = [
  { key: "A", name: "cream", hex: "#F2EAD3" },
  { key: "B", name: "navy", hex: "#1F2A44" },
  { key: "C", name: "red", hex: "#B3282D" },
  { key: "D", name: "gold", hex: "#D9A441" },
  { key: "E", name: "green", hex: "#3C6E47" },
];

// Our own 5×7 block letters, drawn for this corpus (top row first).
const GLYPHS: Record<string, string[]> = {
  A: [".###.", "#...#", "#...#", "#####", "#...#", "#...#", "#...#"],
  B: ["####.", "#...#", "#...#", "####.", "#...#", "#...#", "####."],
  C: [".###.", "#...#", "#....", "#....", "#....", "#...#", ".###."],
  E: ["#####", "#....", "#....", "####.", "#....", "#....", "#####"],
  H: ["#...#", "#...#", "#...#", "#####", "#...#", "#...#", "#...#"],
  J: ["..###", "...#.", "...#.", "...#.", "...#.", "#..#.", ".##.."],
  K: ["#...#", "#..#.", "#.#..", "##...", "#.#..", "#..#.", "#...#"],
  M: ["#...#", "##.##", "#.#.#", "#.#.#", "#...#", "#...#", "#...#"],
  R: ["####.", "#...#", "#...#", "####.", "#.#..", "#..#.", "#...#"],
  S: [".####", "#....", "#....", ".###.", "....#", "....#", "####."],
  T: ["#####", "..#..", "..#..", "..#..", "..#..", "..#..", "..#.."],
  W: ["#...#", "#...#", "#...#", "#.#.#", "#.#.#", "##.##", "#...#"],
};

const MOTIFS: Record<string, string[]> = {
  heart: [".##...##.", "####.####", "#########", "#########", ".#######.", "..#####..", "...###...", "....#...."],
  star: ["....#....", "....#....", "...###...", "#########", ".#######.", "..#####..", "..##.##..", ".##...##.", ".#.....#."],
  snowflake: [
    "#....#....#",
    ".#...#...#.",
    "..#..#..#..",
    "...#.#.#...",
    "....###....",
    "###########",
    "....###....",
    "...#.#.#...",
    "..#..#..#..",
    ".#...#...#.",
    "#....#....#",
  ],
  diamond: ["...#...", "..#.#..", ".#...#.", "#.....#", ".#...#.", "..#.#..", "...#..."],
  tree: ["...#...", "..###..", ".#####.", "..###..", ".#####.", "#######", "...#...", "...#..."],
};

function blank(width: number, height: number, gauge: Gauge): Chart {
  return createChart(width, height, gauge, PALETTE, 0);
}

function stamp(chart: Chart, shape: string[], x0: number, yTop: number, colour: number): void {
  shape.forEach((line, i) => {
    const y = yTop - i;
    Array.from(line).forEach((ch, dx) => {
      const x = x0 + dx;
      if (ch === "#" && x >= 0 && y >= 0 && x < chart.width && y < chart.height) chart.cells[y * chart.width + x] = colour;
    });
  });
}

function letters(chart: Chart, text: string, x0: number, yTop: number, gap: number, colour: number): void {
  let x = x0;
  for (const ch of text) {
    stamp(chart, GLYPHS[ch], x, yTop, colour);
    x += 5 + gap;
  }
}

function dots(chart: Chart, rnd: () => number, density: number, colour: number, free = 0): void {
  for (let i = 0; i < chart.cells.length; i++) if (chart.cells[i] === free && rnd() < density) chart.cells[i] = colour;
}

function blob(chart: Chart, rnd: () => number, cx: number, cy: number, rx: number, ry: number, colour: number): void {
  // An ellipse with a wobbly edge: radius varies with angle by a few random harmonics.
  const k1 = rnd() * 0.25;
  const k2 = rnd() * 0.15;
  const p1 = rnd() * 6.28;
  const p2 = rnd() * 6.28;
  for (let y = 0; y < chart.height; y++) {
    for (let x = 0; x < chart.width; x++) {
      const dx = (x - cx) / rx;
      const dy = (y - cy) / ry;
      const t = Math.atan2(dy, dx);
      const r = 1 + k1 * Math.sin(3 * t + p1) + k2 * Math.sin(5 * t + p2);
      if (dx * dx + dy * dy <= r * r) chart.cells[y * chart.width + x] = colour;
    }
  }
}

interface Case {
  name: string;
  chart: Chart;
  darn: string[];
}

function corpus(): Case[] {
  const rnd = mulberry32(20240611);
  const cases: Case[] = [];
  const g24 = { stitchesPer10cm: 24, rowsPer10cm: 28 };
  const names = Object.keys(MOTIFS);
  const glyphs = Object.keys(GLYPHS);

  for (let i = 0; i < 6; i++) {
    const c = blank(40, 30, g24);
    const n = 2 + Math.floor(rnd() * 4);
    for (let m = 0; m < n; m++) {
      const shape = MOTIFS[names[Math.floor(rnd() * names.length)]];
      stamp(c, shape, Math.floor(rnd() * 30), 10 + Math.floor(rnd() * 19), 2);
    }
    cases.push({ name: `motifs-${i + 1}`, chart: c, darn: ["C"] });
  }
  for (let i = 0; i < 6; i++) {
    const c = blank(36, 12, g24);
    const word = Array.from({ length: 2 + (i % 3) }, () => glyphs[Math.floor(rnd() * glyphs.length)]).join("");
    letters(c, word, 2, 9, 1 + (i % 3), 2);
    cases.push({ name: `letters-${word}`, chart: c, darn: ["C"] });
  }
  {
    // Mitten back of hand, 60 × 80 at a firm gauge: a knitted lattice, initials, a heart, snow.
    const c = blank(60, 80, { stitchesPer10cm: 28, rowsPer10cm: 32 });
    for (let y = 0; y < 80; y++) for (let x = 0; x < 60; x++) if ((x + y) % 8 === 0 || (x - y + 800) % 8 === 0) c.cells[y * 60 + x] = 1;
    for (let y = 20; y < 62; y++) for (let x = 12; x < 48; x++) c.cells[y * 60 + x] = 0;
    letters(c, "JK", 18, 58, 2, 2);
    stamp(c, MOTIFS.heart, 25, 46, 2);
    stamp(c, MOTIFS.star, 14, 34, 4);
    stamp(c, MOTIFS.star, 37, 34, 4);
    for (let y = 22; y < 60; y++) for (let x = 13; x < 47; x++) if (c.cells[y * 60 + x] === 0 && rnd() < 0.035) c.cells[y * 60 + x] = 3;
    cases.push({ name: "mitten-60x80", chart: c, darn: ["C", "D", "E"] });
  }
  {
    // Sweater yoke, 300 × 60: knitted bands, darned stars, trees, dots and a band of small diamonds.
    const c = blank(300, 60, { stitchesPer10cm: 22, rowsPer10cm: 28 });
    for (let x = 0; x < 300; x++) {
      for (const y of [2, 3, 56, 57]) c.cells[y * 300 + x] = 1;
      if (x % 4 < 2) for (const y of [5, 54]) c.cells[y * 300 + x] = 1;
    }
    for (let r = 0; r < 15; r++) {
      stamp(c, MOTIFS.star, r * 20 + 5, 48, 2);
      stamp(c, MOTIFS.tree, r * 20 + 7, 30, 4);
      stamp(c, MOTIFS.diamond, r * 20 + 14, 17, 2);
    }
    for (let y = 7; y < 52; y++) for (let x = 0; x < 300; x++) if (c.cells[y * 300 + x] === 0 && rnd() < 0.02) c.cells[y * 300 + x] = 3;
    cases.push({ name: "yoke-300x60", chart: c, darn: ["C", "D", "E"] });
  }
  for (const [name, density] of [
    ["dots-sparse", 0.02],
    ["dots-medium", 0.06],
    ["dots-dense", 0.15],
  ] as const) {
    const c = blank(40, 40, g24);
    dots(c, rnd, density, 3);
    cases.push({ name, chart: c, darn: ["D"] });
  }
  {
    const c = blank(48, 48, g24);
    for (let y = 1; y < 48; y += 4) for (let x = (y >> 2) % 2 === 0 ? 1 : 3; x < 48; x += 4) c.cells[y * 48 + x] = 3;
    cases.push({ name: "dots-lattice", chart: c, darn: ["D"] });
  }
  for (let i = 0; i < 4; i++) {
    const c = blank(50, 50, g24);
    const n = 1 + (i % 3);
    for (let b = 0; b < n; b++) blob(c, rnd, 10 + rnd() * 30, 10 + rnd() * 30, 5 + rnd() * 10, 5 + rnd() * 10, 2);
    cases.push({ name: `solid-${i + 1}`, chart: c, darn: ["C"] });
  }
  return cases;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function main(): void {
  const rates = defaultDarningRates;
  const sums = { ends: 0, endsBound: 0, carry: 0, carryBound: 0, nEnds: 0, nNaiveEnds: 0, nOver: 0, nNaiveOver: 0 };
  const ms: Record<string, number> = {};
  const cases = corpus();
  // One untimed pass first, so the timings are of compiled code rather than of the JIT warming up.
  for (const c of cases) planDarning(c.chart, { darn: c.darn });
  for (const c of cases) {
    const big = c.chart.width * c.chart.height >= 4800;
    const times: number[] = [];
    let plan = planDarning(c.chart, { darn: c.darn });
    for (let r = 0; r < (big ? 11 : 5); r++) {
      const t0 = performance.now();
      plan = planDarning(c.chart, { darn: c.darn });
      times.push(performance.now() - t0);
    }
    const t = plan.totals;
    const line = {
      case: c.name,
      stitches: t.stitches,
      ends: t.ends,
      endsBound: t.lowerBound.ends,
      carryCm: t.carryCm,
      carryBoundCm: t.lowerBound.carryCm,
      naiveEnds: t.naive.ends,
      naiveCarryCm: t.naive.carryCm,
      ms: Math.round(median(times) * 10) / 10,
    };
    ms[c.name] = line.ms;
    console.log(JSON.stringify(line));
    sums.ends += t.ends;
    sums.endsBound += t.lowerBound.ends;
    sums.carry += t.carryCm;
    sums.carryBound += t.lowerBound.carryCm;
    if (t.naive.ends > 2) {
      sums.nEnds += t.ends;
      sums.nNaiveEnds += t.naive.ends;
      sums.nOver += getOverheadMinutes({ ends: t.ends, carryCm: t.carryCm }, rates);
      sums.nNaiveOver += getOverheadMinutes({ ends: t.naive.ends, carryCm: t.naive.carryCm }, rates);
    }
  }
  const r3 = (v: number) => Math.round(v * 1000) / 1000;
  console.log(
    JSON.stringify({
      summary: true,
      endsRatio: r3(sums.ends / sums.endsBound),
      carryRatio: r3(sums.carry / sums.carryBound),
      vsNaiveEnds: r3(1 - sums.nEnds / sums.nNaiveEnds),
      vsNaiveOverheadMinutes: r3(1 - sums.nOver / sums.nNaiveOver),
      medianMs60x80: ms["mitten-60x80"],
      medianMs300x60: ms["yoke-300x60"],
    }),
  );
}

main();
