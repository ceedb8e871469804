import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { ChartFormatError, chartV1Schema, parseChart, serializeChart, type ChartV1 } from "@/lib/core/chart/format";
import { cellAt, toTrade } from "@/lib/core/chart/model";
import { chartArb, paletteArb } from "./arbitraries";

const valid = (): ChartV1 => ({
  version: 1,
  width: 8,
  height: 3,
  gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 },
  palette: [
    { key: "A", name: "Oat", hex: "#EFE6D2" },
    { key: "B", name: "Rowan red", hex: "#9E2B25" },
  ],
  rows: ["AABBAABB", "ABABABAB", "AAAAAAAA"],
});

function issuesOf(input: unknown): ChartFormatError["issues"] {
  try {
    parseChart(input);
  } catch (e) {
    expect(e).toBeInstanceOf(ChartFormatError);
    return (e as ChartFormatError).issues;
  }
  throw new Error("expected the chart to be rejected");
}

type Edit = (doc: Record<string, unknown> & ChartV1) => unknown;

describe("parseChart rejects bad charts with a trade-numbered message", () => {
  const sixteen = Array.from("ABCDEFGHIJKLMNOP").map((key) => ({ key, name: key, hex: "#000000" }));
  test.each<[string, Edit, string]>([
    ["an unknown key (rows[1] is row 2; index 4 from the left is stitch 4 from the right)", (d) => ({ ...d, rows: ["AABBAABB", "ABABQBAB", "AAAAAAAA"] }), "row 2, stitch 4: key 'Q' is not in the palette"],
    ["an unknown key on the top row, left-most stitch", (d) => ({ ...d, rows: ["ZABBAABB", "ABABABAB", "AAAAAAAA"] }), "row 3, stitch 8: key 'Z' is not in the palette"],
    ["an unknown key on row 1, right-most stitch", (d) => ({ ...d, rows: ["AABBAABB", "ABABABAB", "AAAAAAAC"] }), "row 1, stitch 1: key 'C' is not in the palette"],
    ["a control character in a row", (d) => ({ ...d, rows: ["AABBAABB", "ABABABA\t", "AAAAAAAA"] }), "row 2, stitch 1: key U+0009 is not in the palette"],
    ["a short row", (d) => ({ ...d, rows: ["AABBAABB", "ABABABA", "AAAAAAAA"] }), "row 2 has 7 stitches, expected 8"],
    ["a long row", (d) => ({ ...d, rows: ["AABBAABBA", "ABABABAB", "AAAAAAAA"] }), "row 3 has 9 stitches, expected 8"],
    ["too few rows", (d) => ({ ...d, rows: ["AABBAABB", "ABABABAB"] }), "the chart has 2 rows, expected 3 (its height)"],
    ["too many rows", (d) => ({ ...d, height: 2 }), "the chart has 3 rows, expected 2 (its height)"],
    ["wrong version", (d) => ({ ...d, version: 2 }), "version must be 1 (got 2)"],
    ["missing version", ({ version: _v, ...d }) => d, "version must be 1 (got nothing)"],
    ["a fractional width", (d) => ({ ...d, width: 7.5 }), "width must be a whole number of stitches (got 7.5)"],
    ["a zero width", (d) => ({ ...d, width: 0 }), "width must be at least 1 (got 0)"],
    ["a negative height", (d) => ({ ...d, height: -3 }), "height must be at least 1 (got -3)"],
    ["a width over 400", (d) => ({ ...d, width: 401 }), "width must be at most 400 (got 401)"],
    ["a height over 400", (d) => ({ ...d, height: 401 }), "height must be at most 400 (got 401)"],
    ["a width given as text", (d) => ({ ...d, width: "8" }), 'width must be a number (got "8")'],
    ["a missing height", ({ height: _h, ...d }) => d, "height is missing"],
    ["a duplicate key", (d) => ({ ...d, palette: [...d.palette, { key: "A", name: "Cream", hex: "#FFFFF0" }] }), "palette key 'A' is used twice (by 'Oat' and 'Cream')"],
    ["a two-character key", (d) => ({ ...d, palette: [{ key: "AA", name: "Oat", hex: "#EFE6D2" }, d.palette[1]] }), 'key "AA" must be a single printable character'],
    ["a space as key", (d) => ({ ...d, palette: [{ key: " ", name: "Oat", hex: "#EFE6D2" }, d.palette[1]] }), 'key " " must be a single printable character'],
    ["an empty key", (d) => ({ ...d, palette: [{ key: "", name: "Oat", hex: "#EFE6D2" }, d.palette[1]] }), 'key "" must be a single printable character'],
    ["a short hex", (d) => ({ ...d, palette: [{ key: "A", name: "Oat", hex: "#EFE" }, d.palette[1]] }), 'hex "#EFE" is not a colour of the form #RRGGBB'],
    ["a hex without #", (d) => ({ ...d, palette: [{ key: "A", name: "Oat", hex: "EFE6D2" }, d.palette[1]] }), 'hex "EFE6D2" is not a colour of the form #RRGGBB'],
    ["a non-hex digit", (d) => ({ ...d, palette: [{ key: "A", name: "Oat", hex: "#EFE6DG" }, d.palette[1]] }), 'hex "#EFE6DG" is not a colour of the form #RRGGBB'],
    ["a blank name", (d) => ({ ...d, palette: [{ key: "A", name: "  ", hex: "#EFE6D2" }, d.palette[1]] }), "name must not be blank"],
    ["17 colours", (d) => ({ ...d, palette: [...sixteen, { key: "Q", name: "Q", hex: "#000000" }] }), "palette has 17 colours; at most 16 are allowed"],
    ["an empty palette", (d) => ({ ...d, palette: [] }), "palette must have at least one colour"],
    ["a zero stitch gauge", (d) => ({ ...d, gauge: { stitchesPer10cm: 0, rowsPer10cm: 36 } }), "gauge.stitchesPer10cm must be more than 0 (got 0)"],
    ["a negative row gauge", (d) => ({ ...d, gauge: { stitchesPer10cm: 32, rowsPer10cm: -1 } }), "gauge.rowsPer10cm must be more than 0 (got -1)"],
    ["a missing gauge", ({ gauge: _g, ...d }) => d, "gauge is missing"],
  ])("%s", (_name, edit, message) => {
    const issues = issuesOf(edit(valid() as Record<string, unknown> & ChartV1));
    expect(issues.map((i) => i.message)).toContainEqual(expect.stringContaining(message));
  });

  test("16 colours is the most allowed and is accepted", () => {
    const doc = { ...valid(), palette: sixteen, rows: ["ABCDEFGH", "IJKLMNOP", "AAAAAAAA"] };
    expect(parseChart(doc).palette).toHaveLength(16);
  });

  test("400 × 400 is accepted", () => {
    const doc = { ...valid(), width: 400, height: 400, rows: Array.from({ length: 400 }, () => "A".repeat(400)) };
    expect(parseChart(doc).cells).toHaveLength(160_000);
  });

  test("a misplaced key carries its trade position and JSON path", () => {
    const [issue] = issuesOf({ ...valid(), rows: ["AABBAABB", "ABABQBAB", "AAAAAAAA"] });
    expect(issue).toEqual({ path: "rows[1]", row: 2, stitch: 4, message: "row 2, stitch 4: key 'Q' is not in the palette" });
  });

  test("the error message joins every issue", () => {
    const doc = { ...valid(), rows: ["AABBAABQ", "ABABABA", "AAAAAAAA"] };
    expect(() => parseChart(doc)).toThrow(
      "chart is not valid: row 3, stitch 1: key 'Q' is not in the palette; row 2 has 7 stitches, expected 8",
    );
  });

  test("many misplaced keys are counted rather than listed one by one", () => {
    const doc = { ...valid(), width: 100, height: 1, rows: ["Z".repeat(100)] };
    const issues = issuesOf(doc);
    expect(issues).toHaveLength(51);
    expect(issues[50].message).toBe("50 more stitches use keys that are not in the palette");
  });

  test("not an object at all", () => {
    expect(() => parseChart("hello")).toThrow(ChartFormatError);
    expect(() => parseChart(null)).toThrow("chart is not valid: input must be an object (got null)");
  });
});

describe("orientation", () => {
  test("rows[0] is the top row and the first character the left-most stitch", () => {
    const chart = parseChart(valid());
    // rows[2] = "AAAAAAAA" is row 1 (y 0); rows[0] = "AABBAABB" is the top row (y 2).
    expect(Array.from({ length: 8 }, (_, x) => cellAt(chart, x, 0))).toEqual([0, 0, 0, 0, 0, 0, 0, 0]);
    expect(Array.from({ length: 8 }, (_, x) => cellAt(chart, x, 2))).toEqual([0, 0, 1, 1, 0, 0, 1, 1]);
    // The left-most stitch of a row is the last in trade numbering.
    expect(toTrade(chart, 0, 2)).toEqual({ row: 3, stitch: 8 });
  });

  test("hex is stored in upper case", () => {
    const chart = parseChart({ ...valid(), palette: [{ key: "A", name: "Oat", hex: "#efe6d2" }, valid().palette[1]] });
    expect(chart.palette[0].hex).toBe("#EFE6D2");
  });

  test("a symbol key counts as one stitch", () => {
    const chart = parseChart({ ...valid(), width: 3, height: 1, palette: [{ key: "♥", name: "Red", hex: "#FF0000" }], rows: ["♥♥♥"] });
    expect(chart.cells).toEqual(new Uint8Array([0, 0, 0]));
  });
});

describe("round trip", () => {
  test("serialize then parse gives back the same chart", () => {
    fc.assert(
      fc.property(chartArb({ maxColours: 16 }), (chart) => {
        expect(parseChart(serializeChart(chart))).toEqual(chart);
      }),
    );
  });

  test("parse then serialize gives back the same document", () => {
    const docArb = fc
      .record({ width: fc.integer({ min: 1, max: 12 }), height: fc.integer({ min: 1, max: 12 }), palette: paletteArb(1, 6) })
      .chain(({ width, height, palette }) =>
        fc
          .array(fc.string({ unit: fc.constantFrom(...palette.map((p) => p.key)), minLength: width, maxLength: width }), { minLength: height, maxLength: height })
          .map((rows): ChartV1 => ({ version: 1, width, height, gauge: { stitchesPer10cm: 27.5, rowsPer10cm: 31 }, palette, rows })),
      );
    fc.assert(
      fc.property(docArb, (doc) => {
        expect(chartV1Schema.parse(doc)).toEqual(doc);
        expect(serializeChart(parseChart(doc))).toEqual(doc);
      }),
    );
  });

  test("serializing a cell outside the palette names its trade position", () => {
    const chart = parseChart(valid());
    chart.cells[0] = 7; // bottom-left stitch: row 1, stitch 8
    expect(() => serializeChart(chart)).toThrow("row 1, stitch 8: colour 7 is not in the palette");
  });
});

describe("fixtures", () => {
  const dir = path.resolve("tests/fixtures/charts");
  const files = readdirSync(dir).filter((f) => f.endsWith(".json"));
  test("there are example charts", () => expect(files.length).toBeGreaterThanOrEqual(2));
  test.each(files)("%s parses and round-trips", (file) => {
    const doc = JSON.parse(readFileSync(path.join(dir, file), "utf8"));
    expect(serializeChart(parseChart(doc))).toEqual(doc);
  });
});
