import { describe, expect, test } from "vitest";
import { getContrast, getMarkColour } from "@/lib/core/chart/colour";
import { parseChart } from "@/lib/core/chart/format";
import { rasterizeChart, getRowPx } from "@/lib/core/chart/raster";
import { escapeXml, renderChartSvg, renderPreviewSvg } from "@/lib/core/chart/render-svg";

const doc = {
  version: 1,
  width: 12,
  height: 11,
  gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 },
  palette: [
    { key: "A", name: "Oat", hex: "#EFE6D2" },
    { key: "B", name: "Rowan <red> & \"wine\"", hex: "#9E2B25" },
    { key: "C", name: "Moss", hex: "#3F5E3A" },
  ],
  rows: [
    "AABBAABBAABB",
    ...Array.from({ length: 9 }, () => "ABABABABABAB"),
    "CAAAAAAAAAAC",
  ],
};
const chart = parseChart(doc);

function count(haystack: string, needle: string): number {
  return haystack.split(needle).length - 1;
}

describe("chart SVG", () => {
  const svg = renderChartSvg(chart, { cellPx: 16, title: "Left mitten <back>" });

  test("is one well-formed svg element with escaped text", () => {
    expect(svg.startsWith("<svg xmlns=\"http://www.w3.org/2000/svg\"")).toBe(true);
    expect(svg.endsWith("</svg>")).toBe(true);
    expect(svg).toContain("Rowan &lt;red&gt; &amp; &quot;wine&quot;");
    expect(svg).toContain("Left mitten &lt;back&gt;");
    expect(svg).not.toContain("<red>");
    expect(svg).not.toContain("<back>");
  });

  test("draws a symbol in every cell of each non-main colour", () => {
    // B: 6 on the top row + 9 rows × 6; C: 2 on row 1. A (index 0) is left blank, as on printed charts.
    expect(count(svg, 'href="#dw-sym-1" x')).toBe(6 + 54 + 1); // + its swatch in the key
    expect(count(svg, 'href="#dw-sym-2" x')).toBe(2 + 1);
    expect(svg).not.toContain("dw-sym-0");
  });

  test("numbers rows 1–11 on the right and stitches 1–12 along the bottom, from the right", () => {
    const labels = [...svg.matchAll(/<text x="([\d.]+)" y="([\d.]+)"[^>]*>(\d+)<\/text>/g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]), n: Number(m[3]) }));
    const gridRight = 12 + 12 * 16;
    const rowLabels = labels.filter((l) => l.x > gridRight);
    expect(rowLabels.map((l) => l.n)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11]);
    // Row 1 is the lowest on the page.
    expect(rowLabels[0].y).toBeGreaterThan(rowLabels[10].y);
    const stitchLabels = labels.filter((l) => l.x <= gridRight);
    expect(stitchLabels.map((l) => l.n)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    // Stitch 1 is the right-most.
    expect(stitchLabels[0].x).toBeGreaterThan(stitchLabels[11].x);
  });

  test("bold lines fall after every 10 stitches from the right and 10 rows from the bottom", () => {
    const bold = /<path d="([^"]+)" stroke="#111111" stroke-width="1.6"/.exec(svg)?.[1] ?? "";
    // Stitch 10 from the right of 12 starts at x index 2: left edge 12 + 2 × 16 = 44.
    expect(bold).toContain("M44 ");
    // Above row 10: y = top 12 + title + (11 − 10) × 16.
    expect(bold).toMatch(/M12 \d+h192/);
  });

  test("lists every colour in the key with its name and stitch count", () => {
    expect(svg).toContain("A  Oat (#EFE6D2) · 70 stitches");
    expect(svg).toContain("C  Moss (#3F5E3A) · 2 stitches");
  });

  test("symbol marks stand out on their fill", () => {
    for (const hex of ["#EFE6D2", "#9E2B25", "#3F5E3A", "#FFFF00", "#000080"]) {
      // WCAG 2 relative luminance and contrast ratio (W3C, WCAG 2.1, "contrast ratio" definition).
      expect(getContrast(hex, getMarkColour(hex))).toBeGreaterThanOrEqual(4.5);
    }
    expect(escapeXml(`a<b>&"c"'`)).toBe("a&lt;b&gt;&amp;&quot;c&quot;&#39;");
  });
});

describe("knitted preview SVG", () => {
  test("draws one V per stitch at the gauge's proportions", () => {
    const svg = renderPreviewSvg(chart, { stitchPx: 12 });
    expect(count(svg, '<use href="#dw-st"')).toBe(12 * 11);
    // Stitch w = 10/32 cm, h = 10/36 cm, so at 12 px wide a row is 12 × 32/36 = 10.67 px tall.
    expect(svg).toContain('width="144" height="118"');
    expect(svg).toContain("3.75 × 3.06 cm at 32 stitches and 36 rows per 10 cm");
    // Loops take the stitch colour; the gaps between them a darker shade of it.
    expect(svg).toContain('<g fill="#9E2B25">');
    expect(svg).toContain('fill="#671C18"'); // #9E2B25 × 0.65, rounded
  });
});

describe("raster", () => {
  test("fills each stitch with its colour, top row first, rows as tall as the gauge says", () => {
    const img = rasterizeChart(chart, { pxPerStitch: 4 });
    // 4 px × 32/36 = 3.56 → 4 px per row.
    expect(getRowPx(chart, 4)).toBe(4);
    expect(getRowPx({ gauge: { stitchesPer10cm: 20, rowsPer10cm: 28 } }, 7)).toBe(5); // 7 × 20/28 = 5
    expect([img.width, img.height, img.data.length]).toEqual([48, 44, 48 * 44 * 4]);
    const px = (x: number, y: number) => Array.from(img.data.slice((y * img.width + x) * 4, (y * img.width + x) * 4 + 4));
    expect(px(0, 0)).toEqual([0xef, 0xe6, 0xd2, 255]); // top row, left stitch: A
    expect(px(9, 3)).toEqual([0x9e, 0x2b, 0x25, 255]); // top row, third stitch: B
    expect(px(0, 43)).toEqual([0x3f, 0x5e, 0x3a, 255]); // bottom row, left stitch: C
    expect(px(47, 40)).toEqual([0x3f, 0x5e, 0x3a, 255]); // bottom row, right stitch: C
  });

  test("square aspect and a grid", () => {
    const img = rasterizeChart(chart, { pxPerStitch: 5, aspect: "square", grid: [0, 0, 0, 255] });
    expect([img.width, img.height]).toEqual([60, 55]);
    expect(Array.from(img.data.slice(0, 4))).toEqual([0, 0, 0, 255]);
    const inside = ((2 * img.width + 2) * 4);
    expect(Array.from(img.data.slice(inside, inside + 4))).toEqual([0xef, 0xe6, 0xd2, 255]);
  });

  test("an unusable pixel size is refused", () => {
    expect(() => rasterizeChart(chart, { pxPerStitch: 0 })).toThrow("pxPerStitch must be a whole number from 1 to 64 (got 0)");
  });
});
