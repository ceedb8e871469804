import { describe, expect, it } from "vitest";
import { AUTOSAVE_MAX_WAIT_MS, AUTOSAVE_MS, autosaveDelay, offChartProblem, TOUCH_AUTOSAVE_MS } from "@/components/chart-editor/editor-model";
import { firstStrandSteps } from "@/components/chart-editor/darning-map";

describe("offChartProblem", () => {
  const chart = { width: 20, height: 10 };
  it("accepts a motif that fits, up to the very edges", () => {
    expect(offChartProblem(chart, { width: 5, height: 5 }, { x: 0, y: 0 }, "motif")).toBeNull();
    expect(offChartProblem(chart, { width: 5, height: 5 }, { x: 15, y: 5 }, "motif")).toBeNull();
  });
  it("refuses one that would reach past the left edge or the top, saying by how much", () => {
    const m = offChartProblem(chart, { width: 5, height: 5 }, { x: 17, y: 7 }, "motif");
    expect(m).toMatch(/^Not placed/);
    expect(m).toContain("2 stitches past the left edge");
    expect(m).toContain("2 rows past the top");
    expect(m).toContain("Click further from the edge");
    expect(offChartProblem(chart, { width: 5, height: 5 }, { x: 16, y: 0 }, "motif")).toContain("1 stitch past the left edge");
  });
  it("says when the motif is larger than the chart itself", () => {
    expect(offChartProblem(chart, { width: 25, height: 5 }, { x: 0, y: 0 }, "motif")).toContain("larger than this 20 × 10 chart");
  });
});

describe("autosaveDelay", () => {
  it("waits longer after taps than after mouse edits", () => {
    expect(autosaveDelay({ touch: false, dirtySinceMs: 0, nowMs: 0 })).toBe(AUTOSAVE_MS);
    expect(autosaveDelay({ touch: true, dirtySinceMs: 0, nowMs: 0 })).toBe(TOUCH_AUTOSAVE_MS);
    expect(TOUCH_AUTOSAVE_MS).toBeGreaterThan(AUTOSAVE_MS);
  });
  it("never lets unsaved edits wait beyond the maximum", () => {
    expect(autosaveDelay({ touch: true, dirtySinceMs: 0, nowMs: AUTOSAVE_MAX_WAIT_MS - 1000 })).toBe(1000);
    expect(autosaveDelay({ touch: true, dirtySinceMs: 0, nowMs: AUTOSAVE_MAX_WAIT_MS + 5000 })).toBe(0);
  });
});

describe("firstStrandSteps", () => {
  it("counts the steps of the first strand", () => {
    expect(firstStrandSteps([{ strand: 1 }, { strand: 1 }, { strand: 2 }, { strand: 3 }])).toBe(2);
    expect(firstStrandSteps([{ strand: 1 }])).toBe(1);
    expect(firstStrandSteps([])).toBe(0);
  });
});
