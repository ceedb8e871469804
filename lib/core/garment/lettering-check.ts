// Lettering on a placed chart must read forwards on every piece. A layer (as a design stores it)
// says where its text is set; the chart as knitted must carry that text, not its mirror image.
import { layoutText } from "../chart/lettering/letter";
import { flipHorizontal } from "../chart/ops/flip";
import { placeLettering, type LetteringPlacement } from "../chart/ops/place-lettering";
import type { Chart } from "../chart/model";

/** Ink positions (core x, y) of a layer's text, forwards and as its mirror image in the same box. */
export function letteringInk(layer: LetteringPlacement): { forwards: { x: number; y: number }[]; backwards: { x: number; y: number }[] } {
  const { mask, offset } = layoutText(layer.text, layer.font, layer.box);
  const forwards: { x: number; y: number }[] = [];
  const backwards: { x: number; y: number }[] = [];
  for (let y = 0; y < mask.height; y++) {
    for (let x = 0; x < mask.width; x++) {
      if (!mask.cells[y * mask.width + x]) continue;
      const cy = layer.box.y + offset.y + y;
      forwards.push({ x: layer.box.x + offset.x + x, y: cy });
      // the mirror of the whole box: text laid out and then turned over within the box
      backwards.push({ x: layer.box.x + layer.box.width - 1 - (offset.x + x), y: cy });
    }
  }
  return { forwards, backwards };
}

const inkAt = (chart: Chart, pts: { x: number; y: number }[], colour: number) =>
  pts.every((p) => p.x >= 0 && p.y >= 0 && p.x < chart.width && p.y < chart.height && chart.cells[p.y * chart.width + p.x] === colour);

/** How a layer's text appears in the chart: forwards, backwards (a mirror image) or not at all. */
export function readLettering(chart: Chart, layer: LetteringPlacement): "forwards" | "backwards" | "missing" {
  const ink = letteringInk(layer);
  if (inkAt(chart, ink.forwards, layer.colour)) return "forwards";
  if (inkAt(chart, ink.backwards, layer.colour)) return "backwards";
  return "missing";
}

/** True when the text's mirror image is the text itself (e.g. "HOH" in a symmetric font). */
export function isMirrorSymmetric(layer: LetteringPlacement): boolean {
  const ink = letteringInk(layer);
  const key = (p: { x: number; y: number }) => `${p.x},${p.y}`;
  const f = new Set(ink.forwards.map(key));
  return ink.backwards.every((p) => f.has(key(p)));
}

/**
 * The other piece of a mirrored pair: the chart flipped left to right and each layer set afresh in
 * its mirrored box so it reads forwards. Returns the stitches where a layer without a background
 * would leave its mirrored (backwards) ink showing, so the caller can refuse it.
 */
export function mirrorWithLettering(chart: Chart, layers: LetteringPlacement[]): { chart: Chart; layers: LetteringPlacement[]; backwards: { layer: LetteringPlacement; x: number; y: number } | null } {
  let out = flipHorizontal(chart);
  const moved = layers.map((l) => ({ ...l, box: { ...l.box, x: chart.width - l.box.x - l.box.width } }));
  let backwards: { layer: LetteringPlacement; x: number; y: number } | null = null;
  for (const l of moved) {
    if (l.background === undefined && !isMirrorSymmetric(l) && !backwards) {
      // the flipped chart carries this text backwards; without a background nothing clears it
      const ink = letteringInk(l);
      const f = new Set(ink.forwards.map((p) => `${p.x},${p.y}`));
      const stray = ink.backwards.find((p) => !f.has(`${p.x},${p.y}`));
      if (stray) backwards = { layer: l, x: stray.x, y: stray.y };
    }
    out = placeLettering(out, l);
  }
  return { chart: out, layers: moved, backwards };
}
