import { MAX_HEIGHT, MAX_WIDTH, cloneChart, type Chart, type Point } from "../model";

/**
 * A new width × height chart covered edge to edge with copies of `repeat`; `origin` is where one
 * copy's bottom-left cell falls (default 0, 0), so the repeat can be centred on a piece.
 */
export function tileRepeat(repeat: Chart, width: number, height: number, origin: Point = { x: 0, y: 0 }): Chart {
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1 || width > MAX_WIDTH || height > MAX_HEIGHT) {
    throw new RangeError(`a chart must be from 1 × 1 to ${MAX_WIDTH} × ${MAX_HEIGHT} stitches (asked for ${width} × ${height})`);
  }
  const rw = repeat.width;
  const rh = repeat.height;
  const cells = new Uint8Array(width * height);
  // Build one full row per repeat row, then copy it to every chart row that uses it.
  const line = new Uint8Array(width);
  for (let y = 0; y < height; y++) {
    const ry = (((y - origin.y) % rh) + rh) % rh;
    const src = ry * rw;
    for (let x = 0; x < width; x++) line[x] = repeat.cells[src + ((((x - origin.x) % rw) + rw) % rw)];
    cells.set(line, y * width);
  }
  return { ...cloneChart(repeat, cells), width, height };
}
