// A design keeps its lettering apart from the knitted pattern so the text can be re-set, moved or
// mirrored without losing the stitches underneath: base cells + lettering layers, flattened on demand.
import { z } from "zod";
import { chartV1Schema, parseChart, serializeChart, type ChartV1 } from "./format";
import { FONT_IDS } from "./lettering/letter";
import type { FontId } from "./lettering/pixel-font";
import type { Chart, Rect } from "./model";
import { flipHorizontal } from "./ops/flip";
import { placeLettering, type LetteringPlacement } from "./ops/place-lettering";
import { fieldErrorMap, joinIssues, toFieldIssues } from "./zod-messages";

export interface LayeredDesign {
  /** the pattern without any lettering */
  base: Chart;
  /** drawn over the base in order, later layers on top */
  lettering: LetteringPlacement[];
}

/** The chart as knitted: the base with every lettering layer set on it. */
export function flattenDesign(design: LayeredDesign): Chart {
  return design.lettering.reduce((chart, placement) => placeLettering(chart, placement), design.base);
}

/** The same box seen in a left-right mirror of a chart `width` stitches wide. */
export function mirrorBox(box: Rect, width: number): Rect {
  return { ...box, x: width - box.x - box.width };
}

/** Mirrors the pattern left to right; each text box moves to its mirrored place but its text still reads forwards. */
export function mirrorDesign(design: LayeredDesign): LayeredDesign {
  return {
    base: flipHorizontal(design.base),
    lettering: design.lettering.map((p) => ({ ...p, box: mirrorBox(p.box, design.base.width) })),
  };
}

/**
 * A left and right piece (a pair of mittens, two fronts): the right is the left's mirror image,
 * except that lettering is set afresh so it reads left to right on both.
 */
export function makeMirroredPair(base: Chart, lettering: LetteringPlacement[]): { left: Chart; right: Chart; rightLettering: LetteringPlacement[] } {
  const right = mirrorDesign({ base, lettering });
  return { left: flattenDesign({ base, lettering }), right: flattenDesign(right), rightLettering: right.lettering };
}

// Stored form: the base chart in exchange format v1 plus lettering layers naming colours by key.
const count = (field: string, min: number) =>
  z.number().int({ error: `${field} must be a whole number of stitches` }).min(min, { error: `${field} must be at least ${min}` });

export const letteringV1Schema = z.object({
  text: z.string().min(1, { error: "text must not be empty" }).max(60, { error: "text must be at most 60 characters" }),
  font: z.enum(FONT_IDS as [FontId, ...FontId[]], { error: `font must be ${FONT_IDS.join(" or ")}` }),
  box: z.object({ x: count("box.x", 0), y: count("box.y", 0), width: count("box.width", 1), height: count("box.height", 1) }),
  key: z.string(),
  backgroundKey: z.string().optional(),
});

export const designV1Schema = z.object({
  version: z.literal(1, { error: "version must be 1" }),
  chart: chartV1Schema,
  lettering: z.array(letteringV1Schema).max(20, { error: "a design may have at most 20 lettering layers" }),
});

export type DesignV1 = z.infer<typeof designV1Schema>;

export class DesignFormatError extends Error {
  constructor(readonly issues: { path: string; message: string }[]) {
    super(`design is not valid: ${joinIssues(issues)}`);
    this.name = "DesignFormatError";
  }
}

export function parseDesign(input: unknown): LayeredDesign {
  const result = designV1Schema.safeParse(input, { error: fieldErrorMap() });
  if (!result.success) throw new DesignFormatError(toFieldIssues(result.error.issues));
  const base = parseChart(result.data.chart);
  const index = new Map(base.palette.map((c, i) => [c.key, i]));
  const issues: { path: string; message: string }[] = [];
  const lettering: LetteringPlacement[] = [];
  result.data.lettering.forEach((l, i) => {
    const colour = index.get(l.key);
    const background = l.backgroundKey === undefined ? undefined : index.get(l.backgroundKey);
    if (colour === undefined) issues.push({ path: `lettering[${i}].key`, message: `lettering[${i}].key '${l.key}' is not in the palette` });
    if (l.backgroundKey !== undefined && background === undefined) {
      issues.push({ path: `lettering[${i}].backgroundKey`, message: `lettering[${i}].backgroundKey '${l.backgroundKey}' is not in the palette` });
    }
    if (colour !== undefined) lettering.push({ text: l.text, font: l.font, box: { ...l.box }, colour, ...(background === undefined ? {} : { background }) });
  });
  if (issues.length > 0) throw new DesignFormatError(issues);
  const design = { base, lettering };
  try {
    flattenDesign(design); // a box off the chart or text too long is reported now, not at render time
  } catch (e) {
    throw new DesignFormatError([{ path: "lettering", message: (e as Error).message }]);
  }
  return design;
}

export function serializeDesign(design: LayeredDesign): DesignV1 {
  const chart: ChartV1 = serializeChart(design.base);
  return {
    version: 1,
    chart,
    lettering: design.lettering.map((p) => ({
      text: p.text,
      font: p.font,
      box: { x: p.box.x, y: p.box.y, width: p.box.width, height: p.box.height },
      key: design.base.palette[p.colour].key,
      ...(p.background === undefined ? {} : { backgroundKey: design.base.palette[p.background].key }),
    })),
  };
}
