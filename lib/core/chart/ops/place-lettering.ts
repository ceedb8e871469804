import { assertColour, cloneChart, type Chart, type Rect } from "../model";
import { LetteringError, layoutText } from "../lettering/letter";
import type { FontId } from "../lettering/pixel-font";

/** A line of text set in a box on a chart; the box is in core coordinates (bottom-left cell). */
export interface LetteringPlacement {
  text: string;
  font: FontId;
  box: Rect;
  /** palette index of the ink */
  colour: number;
  /** palette index painted over the rest of the box; leave out to let the chart show through */
  background?: number;
}

/** Sets the text centred in its box; throws when the box leaves the chart or the text does not fit. */
export function placeLettering(chart: Chart, placement: LetteringPlacement): Chart {
  assertColour(chart, placement.colour);
  if (placement.background !== undefined) assertColour(chart, placement.background);
  const { box } = placement;
  if (box.x < 0 || box.y < 0 || box.width < 1 || box.height < 1 || box.x + box.width > chart.width || box.y + box.height > chart.height) {
    throw new LetteringError(
      `the lettering box for '${placement.text}' (${box.width} × ${box.height} at x ${box.x}, y ${box.y}) does not lie inside the ${chart.width} × ${chart.height} chart`,
    );
  }
  const { mask, offset } = layoutText(placement.text, placement.font, box);
  const out = cloneChart(chart);
  const w = chart.width;
  if (placement.background !== undefined) {
    for (let y = box.y; y < box.y + box.height; y++) out.cells.fill(placement.background, y * w + box.x, y * w + box.x + box.width);
  }
  for (let y = 0; y < mask.height; y++) {
    const row = (box.y + offset.y + y) * w + box.x + offset.x;
    for (let x = 0; x < mask.width; x++) if (mask.cells[y * mask.width + x]) out.cells[row + x] = placement.colour;
  }
  return out;
}
