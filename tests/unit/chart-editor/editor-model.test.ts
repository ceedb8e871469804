import { describe, expect, test } from "vitest";
import { createChart, paintCell, parseChart, placeLettering, serializeChart, undo } from "@/lib/core/chart";
import { commitEdit, layersOf, mirrorForPair, nextFreeKey, pairArea, toEditorEntries, toPlacement, toStored, type LayerBook, type LetteringLayer } from "@/components/chart-editor/editor-model";
import { floatCells } from "@/components/chart-editor/plan-panel";

const palette = [
  { key: "A", name: "Oat", hex: "#EFE6D2" },
  { key: "B", name: "Red", hex: "#9E2B25" },
];
const gauge = { stitchesPer10cm: 32, rowsPer10cm: 36 };

describe("editor model", () => {
  test("lettering layers follow their chart through undo", () => {
    const book: LayerBook = new WeakMap();
    const [entry] = toEditorEntries([{ area: "a", label: "A", chart: serializeChart(createChart(20, 9, gauge, palette)) }], book);
    const layer: LetteringLayer = { text: "AB", font: "5x7", box: { x: 2, y: 1, width: 15, height: 7 }, key: "B", backgroundKey: "A" };
    const lettered = placeLettering(entry.history.present, toPlacement(entry.history.present, layer));
    const e1 = commitEdit(book, entry, lettered, [layer]);
    const e2 = commitEdit(book, e1, paintCell(lettered, { x: 0, y: 0 }, 1));
    expect(layersOf(book, e2.history.present)).toEqual([layer]);
    expect(toStored(book, [e2])[0].lettering).toEqual([layer]);
    const back = { ...e2, history: undo(undo(e2.history)) };
    expect(layersOf(book, back.history.present)).toEqual([]);
    expect(toStored(book, [back])[0].lettering).toBeUndefined();
  });

  test("a mirrored pair mirrors the pattern but re-sets the lettering so it reads forwards", () => {
    let base = createChart(21, 9, gauge, palette);
    base = paintCell(base, { x: 0, y: 0 }, 1); // a mark at the bottom-left
    const layer: LetteringLayer = { text: "L", font: "5x7", box: { x: 1, y: 1, width: 7, height: 7 }, key: "B", backgroundKey: "A" };
    const left = placeLettering(base, toPlacement(base, layer));
    const right = mirrorForPair(left, [layer]);
    expect(right.layers[0].box.x).toBe(21 - 1 - 7);
    expect(right.chart.cells[20]).toBe(1); // the mark moved to the bottom-right
    // the L set afresh in the mirrored box is the same stitches as the L in the left box, shifted
    const text = (c: typeof left, x0: number) =>
      Array.from({ length: 7 }, (_, y) => Array.from({ length: 7 }, (_, x) => c.cells[(1 + y) * 21 + x0 + x]).join("")).join("/");
    expect(text(right.chart, 13)).toBe(text(left, 1));
  });

  test("pair areas, free keys and float cells", () => {
    expect(pairArea("back-of-hand-left")).toEqual({ area: "back-of-hand-right", suffix: "right" });
    expect(pairArea("cuff")).toEqual({ area: "cuff-right", suffix: "right" });
    expect(nextFreeKey(parseChart({ version: 1, width: 1, height: 1, gauge, palette, rows: ["A"] }))).toBe("C");
    // a float from stitch 9 wrapping to stitch 2 on a 10-stitch row: stitches 9, 10, 1, 2
    const cells = floatCells(
      {
        rows: [{ row: 3, longestFloat: 4, catches: 1, floats: [{ carried: "B", fromStitch: 9, toStitch: 2, length: 4, catchStitches: [1] }] }],
      } as unknown as Parameters<typeof floatCells>[0],
      10,
    );
    expect(cells.map((c) => c.x)).toEqual([1, 0, 9, 8]);
    expect(cells.every((c) => c.y === 2)).toBe(true);
  });
});
