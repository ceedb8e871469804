// Our motif library: two-colour repeats drawn as data. '.' is the background, 'X' the pattern colour.
// Rows are written top row first, as on paper; width × height is the repeat (margins included), so
// tiling a motif edge to edge spaces it as designed. Borders and all-overs keep every float (a run of
// one colour that the other yarn is carried behind) to 5 stitches or fewer even when tiled; pictorial
// motifs keep solid runs to 7 or fewer, and their background floats are left for the float check.

export type MotifKind = "border" | "all-over" | "motif";

export interface Motif {
  id: string;
  name: string;
  /** the first tag is the kind; the rest describe the theme */
  tags: readonly [MotifKind, ...string[]];
  width: number;
  height: number;
  /** top row first; '.' background, 'X' pattern colour */
  rows: readonly string[];
}

export const MOTIF_BACKGROUND = ".";
export const MOTIF_PATTERN = "X";

export const MOTIFS: readonly Motif[] = [
  {
    id: "lice",
    name: "Scattered lice",
    tags: ["all-over", "peerie", "geometric"],
    width: 4,
    height: 4,
    rows: ["X...", "....", "..X.", "...."],
  },
  {
    id: "checks",
    name: "Small checks",
    tags: ["all-over", "geometric"],
    width: 4,
    height: 4,
    rows: ["XX..", "XX..", "..XX", "..XX"],
  },
  {
    id: "diagonal",
    name: "Barber-pole diagonal",
    tags: ["all-over", "geometric", "stripe"],
    width: 6,
    height: 6,
    rows: ["XX....", ".XX...", "..XX..", "...XX.", "....XX", "X....X"],
  },
  {
    id: "lattice",
    name: "Seeded lattice",
    tags: ["all-over", "geometric", "diamond"],
    width: 8,
    height: 8,
    rows: ["X...X...", ".X.....X", "..X...X.", "...X.X..", "X...X...", "...X.X..", "..X...X.", ".X.....X"],
  },
  {
    id: "ripple",
    name: "Ripple chevron",
    tags: ["all-over", "geometric", "chevron"],
    width: 8,
    height: 4,
    rows: [".XX...XX", "..XX.XX.", "X..XXX..", "XX..X..X"],
  },
  {
    id: "crosses",
    name: "Little crosses",
    tags: ["border", "peerie", "cross"],
    width: 4,
    height: 3,
    rows: [".X..", "XXX.", ".X.."],
  },
  {
    id: "zigzag",
    name: "Zigzag peerie",
    tags: ["border", "peerie", "geometric"],
    width: 6,
    height: 4,
    rows: ["...X..", "..X.X.", ".X...X", "X....."],
  },
  {
    id: "diamond-peerie",
    name: "Diamond peerie",
    tags: ["border", "peerie", "diamond"],
    width: 6,
    height: 5,
    rows: ["..X...", ".XXX..", "XX.XX.", ".XXX..", "..X..."],
  },
  {
    id: "heart-peerie",
    name: "Heart peerie",
    tags: ["border", "peerie", "heart"],
    width: 6,
    height: 5,
    rows: [".X.X..", "XXXXX.", ".XXX..", "..X...", "......"],
  },
  {
    id: "heart",
    name: "Heart",
    tags: ["motif", "heart"],
    width: 9,
    height: 9,
    rows: [
      ".........",
      "..X...X..",
      ".XXX.XXX.",
      ".XXXXXXX.",
      ".XXXXXXX.",
      "..XXXXX..",
      "...XXX...",
      "....X....",
      ".........",
    ],
  },
  {
    id: "snowflake-small",
    name: "Small snowflake",
    tags: ["motif", "winter", "snowflake"],
    width: 9,
    height: 9,
    rows: [
      ".........",
      ".X..X..X.",
      "..X.X.X..",
      "...XXX...",
      ".XXX.XXX.",
      "...XXX...",
      "..X.X.X..",
      ".X..X..X.",
      ".........",
    ],
  },
  {
    id: "snowflake-large",
    name: "Frost snowflake",
    tags: ["motif", "winter", "snowflake"],
    width: 13,
    height: 13,
    rows: [
      ".............",
      "......X......",
      "....X.X.X....",
      "...X.XXX.X...",
      "..X...X...X..",
      "...X..X..X...",
      ".XXXXX.XXXXX.",
      "...X..X..X...",
      "..X...X...X..",
      "...X.XXX.X...",
      "....X.X.X....",
      "......X......",
      ".............",
    ],
  },
  {
    id: "star-eight",
    name: "Eight-petal star",
    tags: ["motif", "star", "winter"],
    width: 15,
    height: 13,
    rows: [
      "...............",
      "..X.........X..",
      "..XX.......XX..",
      "..XXX.....XXX..",
      "..XXXX...XXXX..",
      "..XXXXX.XXXXX..",
      ".......X.......",
      "..XXXXX.XXXXX..",
      "..XXXX...XXXX..",
      "..XXX.....XXX..",
      "..XX.......XX..",
      "..X.........X..",
      "...............",
    ],
  },
  {
    id: "rose",
    name: "Compass rose",
    tags: ["motif", "flower", "geometric"],
    width: 13,
    height: 13,
    rows: [
      ".............",
      "......X......",
      "...X.XXX.X...",
      "...XX.X.XX...",
      "....XX.XX....",
      "..XX.XXX.XX..",
      ".XXXX.X.XXXX.",
      "..XX.XXX.XX..",
      "....XX.XX....",
      "...XX.X.XX...",
      "...X.XXX.X...",
      "......X......",
      ".............",
    ],
  },
  {
    id: "fir-tree",
    name: "Snowy fir",
    tags: ["motif", "tree", "winter"],
    width: 11,
    height: 13,
    rows: [
      "...........",
      ".....X.....",
      "....XXX....",
      "...XXXXX...",
      "....XXX....",
      "...XX.XX...",
      "..XXXXXXX..",
      "....X.X....",
      "..XXX.XXX..",
      ".XXX.X.XXX.",
      ".....X.....",
      "....XXX....",
      "...........",
    ],
  },
  {
    id: "reindeer",
    name: "Reindeer",
    tags: ["motif", "animal", "winter"],
    width: 15,
    height: 15,
    rows: [
      "...............",
      "..X.X.X........",
      "..XXXX.........",
      "...XX..........",
      "...XXX.........",
      "..XXXX.........",
      ".XXXXX.........",
      "....XXX........",
      "....XXXXXXX.X..",
      ".....XXXXXXX...",
      ".....XXXXXX....",
      ".....X.X..X.X..",
      ".....X.X..X.X..",
      "....X...XX...X.",
      "...............",
    ],
  },
  {
    id: "bird",
    name: "Wren",
    tags: ["motif", "animal", "bird"],
    width: 13,
    height: 12,
    rows: [
      ".............",
      "....XXX......",
      "...XX.XX.....",
      ".XXXXXXX.....",
      "....XXXX...XX",
      "....XXXXX.XXX",
      "....XXX.XXXX.",
      ".....XXX.XX..",
      "......XXXX...",
      ".......X.....",
      "......XX.....",
      ".............",
    ],
  },
  {
    id: "fox",
    name: "Fox",
    tags: ["motif", "animal"],
    width: 15,
    height: 13,
    rows: [
      "...............",
      ".X...X.........",
      ".XX.XX.........",
      ".XXXXX.........",
      ".X.X.X......X..",
      "..XXX......XXX.",
      "...X.......XXX.",
      "...XXXXXXX.XX..",
      "...XXXXXXX.X...",
      "....XXXXXXX....",
      "....X.X..X.X...",
      "...XX.XX.XX.XX.",
      "...............",
    ],
  },
];

export function getMotif(id: string): Motif {
  const motif = MOTIFS.find((m) => m.id === id);
  if (!motif) throw new RangeError(`no motif '${id}'; known motifs: ${MOTIFS.map((m) => m.id).join(", ")}`);
  return motif;
}

export function getMotifKind(motif: Pick<Motif, "tags">): MotifKind {
  return motif.tags[0];
}

/**
 * The longest run of one colour in any row when the motif is tiled side by side, per colour:
 * a run of background is a float of the pattern yarn behind it, and the other way round.
 * Rows of a single colour carry no second yarn and are skipped.
 */
export function getLongestRuns(motif: Pick<Motif, "rows" | "width">): { background: number; pattern: number } {
  let background = 0;
  let pattern = 0;
  for (const row of motif.rows) {
    if (!row.includes(MOTIF_PATTERN) || !row.includes(MOTIF_BACKGROUND)) continue;
    // Three copies are enough to see every run that wraps across the repeat edge.
    const tiled = row.repeat(3);
    let run = 0;
    for (let i = 0; i < tiled.length; i++) {
      run = i > 0 && tiled[i] === tiled[i - 1] ? run + 1 : 1;
      if (tiled[i] === MOTIF_BACKGROUND) background = Math.max(background, run);
      else pattern = Math.max(pattern, run);
    }
  }
  return { background, pattern };
}
