// Charts placed on areas: each chart cell is mapped onto the real stitch it stands for, on every
// piece that has the area and on every repeat; cells outside the shape are never knitted, so
// paint there is refused. Colours of all charts are joined by palette key.
import { MAX_PALETTE, type Chart, type PaletteColour } from "../chart/model";
import { LetteringError } from "../chart/lettering/letter";
import { findChartArea, inShapeColumns } from "./build-garment";
import { GarmentError } from "./garment-error";
import { mirrorWithLettering, readLettering } from "./lettering-check";
import type { ChartPlacement, Garment, GarmentPiece, NotKnittedCells, PlacedGarment, PlaceOptions } from "./types";

/** The main colour when no chart is placed: the plain garment. */
export const PLAIN_MAIN_COLOUR: PaletteColour = { key: "A", name: "Main colour", hex: "#D9CFBF" };

const at = (chart: Chart, x: number, y: number) => `row ${y + 1}, stitch ${chart.width - x}`;

function joinPalettes(placements: ChartPlacement[]): { palette: PaletteColour[]; maps: number[][] } {
  const palette: PaletteColour[] = [];
  const where: string[] = [];
  const maps = placements.map((p, i) =>
    p.chart.palette.map((c) => {
      const found = palette.findIndex((q) => q.key === c.key);
      if (found >= 0) {
        if (palette[found].hex.toUpperCase() !== c.hex.toUpperCase()) {
          throw new GarmentError(
            `charts[${i}].chart.palette`,
            `key '${c.key}' is ${c.hex} here but ${palette[found].hex} in ${where[found]}: one key, one colour across the garment`,
          );
        }
        return found;
      }
      palette.push({ key: c.key, name: c.name, hex: c.hex.toUpperCase() });
      where.push(`charts[${i}] (${p.area})`);
      return palette.length - 1;
    }),
  );
  if (palette.length === 0) palette.push({ ...PLAIN_MAIN_COLOUR });
  if (palette.length > MAX_PALETTE) {
    throw new GarmentError("charts", `the charts use ${palette.length} colours between them (keys ${palette.map((c) => c.key).join(", ")}); a garment may use at most ${MAX_PALETTE}`);
  }
  return { palette, maps };
}

/** The chart each piece knits on an area: a placement for that piece, else one for every piece. */
function chooseCharts(garment: Garment, placements: ChartPlacement[]): Map<string, Map<string, number>> {
  const chosen = new Map<string, Map<string, number>>(garment.pieces.map((p) => [p.name, new Map()]));
  const general = new Map<string, number>();
  const specific = new Map<string, number>();
  placements.forEach((p, i) => {
    const field = `charts[${i}]`;
    const area = findChartArea(garment, p.area, `${field}.area`);
    if (p.chart.width !== area.width || p.chart.height !== area.height) {
      throw new GarmentError(
        `${field}.chart`,
        `the chart for '${p.area}' is ${p.chart.width} × ${p.chart.height} (stitches × rows) but the area is ${area.width} × ${area.height}${area.repeats > 1 ? ` (one of its ${area.repeats} repeats)` : ""}`,
      );
    }
    const holders = garment.pieces.filter((g) => g.areas.some((a) => a.name === p.area && a.charted));
    if (p.piece !== undefined) {
      const piece = holders.find((g) => g.name === p.piece);
      if (!piece) {
        throw new GarmentError(`${field}.piece`, `no piece '${p.piece}' has the area '${p.area}'; the pieces with it are ${holders.map((g) => `'${g.name}'`).join(", ")}`);
      }
      const k = `${p.piece}\u0000${p.area}`;
      if (specific.has(k)) throw new GarmentError(field, `a second chart for '${p.area}' on the ${p.piece} (the first is charts[${specific.get(k)}])`);
      specific.set(k, i);
    } else {
      if (general.has(p.area)) throw new GarmentError(field, `a second chart for '${p.area}' (the first is charts[${general.get(p.area)}]); give "piece" to set one piece's chart apart`);
      general.set(p.area, i);
    }
    if (p.mirror && !holders.some((g) => g.pairedWith !== null)) {
      throw new GarmentError(`${field}.mirror`, `'${p.area}' is not on a pair of pieces, so there is nothing to mirror`);
    }
  });
  for (const piece of garment.pieces) {
    const map = chosen.get(piece.name)!;
    for (const a of piece.areas) {
      if (!a.charted) continue;
      const i = specific.get(`${piece.name}\u0000${a.name}`) ?? general.get(a.name);
      if (i !== undefined) map.set(a.name, i);
    }
  }
  return chosen;
}

/** Paint in cells the shape does not knit (above decreases, outside a sector's narrowing): refused, or marked. */
function checkOutsideShape(garment: Garment, p: ChartPlacement, i: number, mode: "refuse" | "ignore"): NotKnittedCells | null {
  const piece = garment.pieces.find((g) => g.areas.some((a) => a.name === p.area && a.charted))!;
  const area = piece.areas.find((a) => a.name === p.area && a.charted)!;
  const { chart } = p;
  let first: { x: number; y: number } | null = null;
  let more = 0;
  for (let y = 0; y < chart.height; y++) {
    const inside = new Set(inShapeColumns(area.width, area.rowStitches[y], area.narrowing));
    if (inside.size === area.width) continue;
    for (let x = chart.width - 1; x >= 0; x--) {
      if (inside.has(x) || chart.cells[y * chart.width + x] === 0) continue;
      if (!first) first = { x, y };
      else more += 1;
    }
  }
  if (!first) return null;
  const why =
    area.narrowing === "sector end" ? "outside the sector's narrowing" : area.narrowing === "edges" ? "beyond the decreases at the top" : "on a stitch decreased away";
  const key = chart.palette[chart.cells[first.y * chart.width + first.x]].key;
  const place = `${at(chart, first.x, first.y)} (row from the bottom, stitch from the right)`;
  if (mode === "ignore") {
    return { area: p.area, chartIndex: i, cells: more + 1, first: `${p.area}: ${place} is painted '${key}' but lies outside the shape, ${why}: not knitted, not counted` };
  }
  throw new GarmentError(
    `charts[${i}].chart`,
    `${p.area}: ${place} is painted '${key}' but lies outside the shape, ${why}; only row ${first.y + 1}'s ${area.rowStitches[first.y]} stitches are knitted${more > 0 ? ` (${more} more cells like it)` : ""}`,
  );
}

function checkLettering(p: ChartPlacement, chart: Chart, i: number, pieceName: string): void {
  for (const [j, layer] of (p.lettering ?? []).entries()) {
    let read: ReturnType<typeof readLettering>;
    try {
      read = readLettering(chart, layer);
    } catch (e) {
      if (e instanceof LetteringError) throw new GarmentError(`charts[${i}].lettering[${j}]`, e.message);
      throw e;
    }
    if (read === "forwards") continue;
    const place = `box at row ${layer.box.y + 1}, stitch ${chart.width - layer.box.x - layer.box.width + 1}–${chart.width - layer.box.x} from the right`;
    throw new GarmentError(
      `charts[${i}].lettering[${j}]`,
      read === "backwards"
        ? `'${layer.text}' reads backwards on the ${pieceName} (${p.area}, ${place}): set the text afresh so it reads left to right`
        : `'${layer.text}' is not set in the chart for '${p.area}' where its layer says (${place})`,
    );
  }
}

export function placeCharts(garment: Garment, placements: ChartPlacement[], opts: PlaceOptions = {}): PlacedGarment {
  const chosen = chooseCharts(garment, placements);
  const notKnitted: NotKnittedCells[] = [];
  placements.forEach((p, i) => {
    const outside = checkOutsideShape(garment, p, i, opts.outsideShape ?? "refuse");
    if (outside) notKnitted.push(outside);
    // every layer as given: inside the chart, and set in it reading forwards
    const first = p.piece ?? garment.pieces.find((g) => g.areas.some((a) => a.name === p.area && a.charted))!.name;
    checkLettering(p, p.chart, i, first);
  });
  const { palette, maps } = joinPalettes(placements);

  const darn: number[] = [];
  (opts.darn ?? []).forEach((key, j) => {
    const c = palette.findIndex((q) => q.key === key);
    if (c < 0) throw new GarmentError(`darn[${j}]`, `colour '${key}' is in no chart's palette (${palette.map((q) => q.key).join(", ")})`);
    if (c === 0) throw new GarmentError(`darn[${j}]`, `'${key}' is the main colour, knitted in every plain stitch: it cannot be darned`);
    if (darn.includes(c)) throw new GarmentError(`darn[${j}]`, `colour '${key}' is named twice`);
    darn.push(c);
  });

  // The chart each piece knits: the placement's, or its mirror on the second piece of a pair.
  const placed: PlacedGarment["placed"] = [];
  const chartFor = new Map<string, Chart>();
  for (const piece of garment.pieces) {
    for (const [area, i] of chosen.get(piece.name)!) {
      const p = placements[i];
      let chart = p.chart;
      const mirrored = Boolean(p.mirror) && p.piece === undefined && piece.side === "right";
      if (mirrored) {
        const m = mirrorWithLettering(p.chart, p.lettering ?? []);
        if (m.backwards) {
          throw new GarmentError(
            `charts[${i}].lettering`,
            `'${m.backwards.layer.text}' on the ${area} would read backwards on the ${piece.name} (${at(p.chart, m.backwards.x, m.backwards.y)}, row from the bottom, stitch from the right): its layer has no background to clear the mirrored letters; give it a background colour or a chart of its own for the ${piece.name}`,
          );
        }
        chart = m.chart;
        checkLettering({ ...p, lettering: m.layers }, chart, i, piece.name);
      } else checkLettering(p, chart, i, piece.name);
      chartFor.set(`${piece.name}\u0000${area}`, chart);
      placed.push({ piece: piece.name, area, chartIndex: i, mirrored });
    }
  }

  const colours = garment.pieces.map((piece) =>
    piece.parts.map((part) =>
      part.rounds.map((round) => {
        const out = new Uint8Array(round.stitches);
        let k = 0;
        for (const span of round.spans) {
          const chart = span.row >= 0 ? chartFor.get(`${piece.name}\u0000${span.area}`) : undefined;
          const map = chart ? maps[chosen.get(piece.name)!.get(span.area)!] : null;
          for (const x of span.columns) {
            out[k++] = chart && map ? map[chart.cells[span.row * chart.width + x]] : 0;
          }
        }
        return out;
      }),
    ),
  );

  const pins = (opts.pins ?? []).map((pin, j) => {
    const field = `pins[${j}]`;
    const pieces = pin.piece === undefined ? garment.pieces : garment.pieces.filter((g) => g.name === pin.piece);
    if (pieces.length === 0) throw new GarmentError(`${field}.piece`, `no piece '${pin.piece}'; the pieces are ${garment.pieces.map((g) => `'${g.name}'`).join(", ")}`);
    for (const g of pieces) {
      const part = pin.part === undefined ? g.parts[0] : g.parts.find((q) => q.name === pin.part);
      if (!part) throw new GarmentError(`${field}.part`, `the ${g.name} has no part '${pin.part}'; its parts are ${g.parts.map((q) => `'${q.name}'`).join(", ")}`);
      if (!(Number.isInteger(pin.fromRound) && Number.isInteger(pin.toRound) && pin.fromRound >= 1 && pin.toRound >= pin.fromRound && pin.toRound <= part.rounds.length)) {
        throw new GarmentError(field, `rounds ${pin.fromRound}–${pin.toRound} are not rounds of the ${g.name}'s ${part.name} (1–${part.rounds.length})`);
      }
    }
    pin.pair.forEach((key, k) => {
      const c = palette.findIndex((q) => q.key === key);
      if (c < 0) throw new GarmentError(`${field}.pair[${k}]`, `colour '${key}' is in no chart's palette (${palette.map((q) => q.key).join(", ")})`);
      if (darn.includes(c)) throw new GarmentError(`${field}.pair[${k}]`, `colour '${key}' is also to be darned`);
    });
    if (pin.pair[0] === pin.pair[1]) throw new GarmentError(`${field}.pair`, "must name two different colours");
    return { ...pin, pair: [pin.pair[0], pin.pair[1]] as [string, string] };
  });
  const result: PlacedGarment = { garment, palette, darn, pins, colours, placed, notKnitted };
  checkThreeColours(result);
  return result;
}

/** At most two colours are knitted in a round; any more must be darned. */
function checkThreeColours(placed: PlacedGarment): void {
  const { garment, palette, darn } = placed;
  garment.pieces.forEach((piece: GarmentPiece, pi) => {
    piece.parts.forEach((part, qi) => {
      const pinned = (r: number) =>
        placed.pins.some((p) => (p.piece ?? piece.name) === piece.name && (p.part ?? piece.parts[0].name) === part.name && r + 1 >= p.fromRound && r + 1 <= p.toRound);
      part.rounds.forEach((round, r) => {
        if (pinned(r)) return; // the maker chose the two knitted there; the others are darned
        const row = placed.colours[pi][qi][r];
        const seen: number[] = [];
        for (let k = 0; k < row.length; k++) {
          const c = row[k];
          if (darn.includes(c) || seen.includes(c)) continue;
          seen.push(c);
          if (seen.length <= 2) continue;
          // the third colour: say where it is, in the area's chart
          let span = round.spans[0];
          let j = k;
          for (const s of round.spans) {
            if (j < s.columns.length) {
              span = s;
              break;
            }
            j -= s.columns.length;
          }
          const w = garment.sizing.charts.find((a) => a.area === span.area)?.width ?? 0;
          const place = span.row >= 0 ? `; '${palette[c].key}' first at ${span.area} row ${span.row + 1}, stitch ${w - span.columns[j]} from the right${span.repeat > 0 ? ` (repeat ${span.repeat + 1})` : ""}` : "";
          const areas = [...new Set(round.spans.filter((s) => s.row >= 0).map((s) => `${s.area} row ${s.row + 1}`))].join(", ");
          throw new GarmentError(
            "charts",
            `round ${r + 1} of the ${piece.name}${part.name !== piece.name && piece.parts.length > 1 ? `'s ${part.name}` : ""} (${areas}) knits three colours, ${seen.map((s) => `'${palette[s].key}'`).join(", ")}${place}, and none of them is darned: stranded work knits two colours a round; name the others in "darn"`,
          );
        }
      });
    });
  });
}
