import { describe, expect, test } from "vitest";
import { MOTIFS, getLongestRuns, getMotif, getMotifKind } from "@/lib/core/chart/motifs";

describe("motif library", () => {
  test("has at least 16 motifs with unique ids, of every kind", () => {
    expect(MOTIFS.length).toBeGreaterThanOrEqual(16);
    expect(new Set(MOTIFS.map((m) => m.id)).size).toBe(MOTIFS.length);
    expect(new Set(MOTIFS.map(getMotifKind))).toEqual(new Set(["border", "all-over", "motif"]));
    for (const theme of ["star", "snowflake", "heart", "tree", "peerie", "animal", "geometric"]) {
      expect(MOTIFS.some((m) => m.tags.includes(theme))).toBe(true);
    }
  });

  test.each(MOTIFS.map((m) => [m.id, m] as const))("%s is drawn to its repeat size in two colours", (_id, m) => {
    expect(m.rows).toHaveLength(m.height);
    for (const row of m.rows) expect(row).toMatch(new RegExp(`^[.X]{${m.width}}$`));
    expect(m.rows.join("")).toContain("X");
    expect(m.rows.join("")).toContain(".");
  });

  // Floats: catch a float over about 5–7 stitches; "every 5 or so" is common
  // (TRADE-REFERENCES.md, "Floats in stranded knitting", several handbooks and teaching pages).
  test.each(MOTIFS.filter((m) => getMotifKind(m) !== "motif").map((m) => [m.id, m] as const))("%s keeps every float to 5 stitches when tiled", (_id, m) => {
    const runs = getLongestRuns(m);
    expect(runs.background).toBeLessThanOrEqual(5);
    expect(runs.pattern).toBeLessThanOrEqual(5);
  });

  test.each(MOTIFS.filter((m) => getMotifKind(m) === "motif").map((m) => [m.id, m] as const))("%s keeps solid runs to 7 stitches", (_id, m) => {
    expect(getLongestRuns(m).pattern).toBeLessThanOrEqual(7);
  });

  test.each<[string[], number, { background: number; pattern: number }]>([
    [["X..."], 4, { background: 3, pattern: 1 }],
    // Runs wrap across the repeat edge: "X..X" tiled is "X..XX..X", so the pattern run is 2.
    [["X..X"], 4, { background: 2, pattern: 2 }],
    [["....", "XX.."], 4, { background: 2, pattern: 2 }],
  ])("longest runs of %o", (rows, width, expected) => {
    expect(getLongestRuns({ rows, width })).toEqual(expected);
  });

  test("an unknown motif is named", () => {
    expect(() => getMotif("unicorn")).toThrow(/no motif 'unicorn'; known motifs: lice, /);
  });
});
