import { assertColour, cloneChart, inBounds, type Chart, type Point } from "../model";

/** The cells of a straight line from `a` to `b`, both ends included (Bresenham's integer method). */
export function getLinePoints(a: Point, b: Point): Point[] {
  const points: Point[] = [];
  let x = a.x;
  let y = a.y;
  const dx = Math.abs(b.x - a.x);
  const dy = -Math.abs(b.y - a.y);
  const sx = a.x < b.x ? 1 : -1;
  const sy = a.y < b.y ? 1 : -1;
  let err = dx + dy;
  for (;;) {
    points.push({ x, y });
    if (x === b.x && y === b.y) return points;
    const e2 = 2 * err;
    if (e2 >= dy) {
      err += dy;
      x += sx;
    }
    if (e2 <= dx) {
      err += dx;
      y += sy;
    }
  }
}

export function drawLine(chart: Chart, a: Point, b: Point, colour: number): Chart {
  assertColour(chart, colour);
  const out = cloneChart(chart);
  for (const p of getLinePoints(a, b)) {
    if (inBounds(chart, p.x, p.y)) out.cells[p.y * chart.width + p.x] = colour;
  }
  return out;
}
