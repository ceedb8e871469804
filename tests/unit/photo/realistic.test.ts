// Charts photographed, as a held-out check would make them: lettering, motifs, stripes and lone
// stitches in 2 to 6 yarn colours (some within ΔE00 5 of each other), drawn at the gauge's
// proportions (8 to 14 px per stitch across), sometimes rescaled to a non-whole number of pixels per
// stitch, Gaussian-blurred (σ 1 to 2 px), noised (σ 6 to 15 sRGB steps) and saved as JPEG (quality
// 70 to 85), then decoded by the edge decoder. Thresholds: 97 % of stitches right with the palette,
// 95 % with only the number of colours after matching colours one to one.
import { describe, expect, test } from "vitest";
import { chartToPixels, photoToChart } from "@/lib/core/photo";
import { degrade } from "./degrade";
import { agreement, agreementMatched, makeCase } from "./synth";

const CASES = Array.from({ length: 14 }, (_, i) => {
  const seed = 101 + i;
  return {
    seed,
    colours: 2 + (i % 5),
    size: i % 7 === 6 ? { width: 40, height: 30 } : { width: 60, height: 80 },
    sigma: [1, 1.5, 2][i % 3],
    noise: [6, 9, 12][i % 3 === 1 ? 2 : i % 3 === 2 ? 0 : 1],
    quality: [70, 75, 80, 85][i % 4],
    scale: i % 4 === 3 ? 0.77 : 1,
  };
});

// Harder cases: noise up to 15, small stitches (8 × 6 px) under σ 1.75–2 px, near-identical yarns next
// to a main colour covering 90 % of the chart; several of these once failed an earlier colour choice.
const HARD = [1004, 1020, 1033, 1049, 1058, 1003, 1011, 1022, 1037, 1045].map((seed) => ({
  seed,
  colours: 2 + (seed % 5),
  size: { width: 60, height: 80 },
  sigma: [1, 1.25, 1.5, 1.75, 2][seed % 5],
  noise: [6, 9, 12, 15][(seed >> 1) % 4],
  quality: [70, 75, 80, 85][(seed >> 2) % 4],
  scale: seed % 3 === 0 ? 0.85 : 1,
}));
CASES.push(...HARD);

const results: { seed: number; palette: number; colours: number }[] = [];

type Image = ReturnType<typeof chartToPixels>;
/** Dark grey lines one pixel wide between the stitches, as on a printed chart. */
function gridLines(img: Image, cellWidth: number, cellHeight: number): Image {
  for (let y = 0; y < img.height; y++) {
    for (let x = 0; x < img.width; x++) if (x % cellWidth === 0 || y % cellHeight === 0) img.data.set([90, 90, 90, 255], (y * img.width + x) * 4);
  }
  return img;
}
/** A warm colour cast, as under indoor light: more red, less green and blue. */
function warmCast(img: Image): Image {
  for (let i = 0; i < img.data.length; i += 4) {
    img.data[i] = Math.min(255, img.data[i] * 1.06 + 6);
    img.data[i + 1] = img.data[i + 1] * 0.95;
    img.data[i + 2] = img.data[i + 2] * 0.88;
  }
  return img;
}

describe("photographed charts come back", () => {
  test.each(CASES)("case $seed: $colours colours, σ $sigma px, noise $noise, JPEG $quality, scale $scale", async (c) => {
    const synth = makeCase(c.seed, c.colours, c.size);
    const photo = await degrade(chartToPixels(synth.chart, synth.cellWidth, synth.cellHeight), { sigma: c.sigma, noise: c.noise, quality: c.quality, seed: c.seed, scale: c.scale });
    const base = { width: synth.chart.width, height: synth.chart.height, gauge: synth.chart.gauge };
    const withPalette = agreement(synth.chart, photoToChart(photo, { ...base, palette: synth.chart.palette }).chart);
    const withColours = agreementMatched(synth.chart, photoToChart(photo, { ...base, colours: c.colours }).chart);
    results.push({ seed: c.seed, palette: withPalette, colours: withColours });
    expect(withPalette).toBeGreaterThanOrEqual(0.97);
    expect(withColours).toBeGreaterThanOrEqual(0.95);
  });

  test.each([
    { seed: 7001, how: "grid lines", change: gridLines },
    { seed: 7004, how: "grid lines", change: gridLines },
    { seed: 7012, how: "a warm cast", change: (img: Image) => warmCast(img) },
    { seed: 7013, how: "a warm cast", change: (img: Image) => warmCast(img) },
  ])("case $seed with $how: the palette as the photo shows it", async ({ seed, change }) => {
    const synth = makeCase(seed, 2 + (seed % 5));
    const drawn = change(chartToPixels(synth.chart, synth.cellWidth, synth.cellHeight), synth.cellWidth, synth.cellHeight);
    const photo = await degrade(drawn, { sigma: 1.5, noise: 10, quality: 75, seed });
    const base = { width: synth.chart.width, height: synth.chart.height, gauge: synth.chart.gauge, palette: synth.chart.palette };
    const adapted = agreement(synth.chart, photoToChart(photo, base).chart);
    const raw = agreement(synth.chart, photoToChart(photo, { ...base, sampling: { adapt: false } }).chart);
    results.push({ seed, palette: adapted, colours: agreementMatched(synth.chart, photoToChart(photo, { ...base, palette: undefined, colours: synth.chart.palette.length }).chart) });
    expect(adapted).toBeGreaterThanOrEqual(0.97);
    expect(adapted).toBeGreaterThanOrEqual(raw);
  });

  test("summary", () => {
    const mean = (k: "palette" | "colours") => results.reduce((s, r) => s + r[k], 0) / results.length;
    const min = (k: "palette" | "colours") => Math.min(...results.map((r) => r[k]));
    const pct = (v: number) => Math.round(v * 10000) / 100;
    console.log(
      `photo accuracy over ${results.length} photographed charts: with the palette mean ${pct(mean("palette"))} %, worst ${pct(min("palette"))} %; ` +
        `with the number of colours mean ${pct(mean("colours"))} %, worst ${pct(min("colours"))} %`,
    );
    expect(results).toHaveLength(CASES.length + 4);
  });
});
