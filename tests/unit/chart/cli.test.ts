import { readFileSync } from "node:fs";
import { describe, expect, test } from "vitest";
import { run as runLetter } from "@/scripts/core-verbs/letter";
import { run as runRender } from "@/scripts/core-verbs/render-svg";
import { run as runValidate } from "@/scripts/core-verbs/validate";

const band = JSON.parse(readFileSync("tests/fixtures/charts/peerie-band.json", "utf8"));

describe("core verbs", () => {
  test("validate returns size and counts", () => {
    expect(runValidate(band)).toEqual({ width: 24, height: 5, counts: { A: 72, B: 48 } });
  });

  test("validate throws the trade-numbered message", () => {
    const rows = [...band.rows];
    rows[4] = "Q" + rows[4].slice(1); // bottom row, left-most stitch
    expect(() => runValidate({ ...band, rows })).toThrow("chart is not valid: row 1, stitch 24: key 'Q' is not in the palette");
  });

  test("render-svg takes a bare chart or a request and returns an SVG string", () => {
    expect(runRender(band)).toMatch(/^<svg [^]*dw-sym-1[^]*<\/svg>\n$/);
    expect(runRender({ chart: band, kind: "preview" })).toContain('href="#dw-st"');
    expect(() => runRender({ chart: band, kind: "photo" })).toThrow('render-svg input: kind must be "chart" or "preview"');
  });

  test("letter returns a chart in exchange format", () => {
    const out = runLetter({ text: "Jo", font: "3x5", box: { width: 9, height: 5 } }) as { width: number; rows: string[] };
    expect(out.width).toBe(9);
    // J and O are 3 wide with one gap: 7 stitches, centred in 9 with one blank column each side.
    expect(out.rows).toEqual(["...X..X..", "...X.X.X.", "...X.X.X.", ".X.X.X.X.", "..X...X.."]);
  });

  test.each<[unknown, string]>([
    [{ font: "5x7", box: { width: 9, height: 9 } }, "letter input: text must be a string"],
    [{ text: "A", font: "7x9", box: { width: 9, height: 9 } }, 'letter input: font must be "5x7" or "3x5"'],
    [{ text: "A", font: "5x7", box: { width: 9 } }, "letter input: box.height is missing"],
    [{ text: "A", font: "5x7", box: { width: 0, height: 9 } }, "letter input: box.width must be at least 1"],
    [{ text: "ABCDEFG", font: "5x7", box: { width: 30, height: 9 } }, "'ABCDEFG' needs 41 × 7 stitches; the box is 30 × 9"],
    [{ text: "A", font: "5x7", box: { width: 9, height: 9 }, palette: [{ key: "A", name: "x", hex: "#000000" }] }, "palette must have at least two colours"],
  ])("letter rejects %o", (input, message) => {
    expect(() => runLetter(input)).toThrow(message);
  });
});
