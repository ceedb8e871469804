import { assertColour, cloneChart, inBounds, type Chart, type Point } from "../model";

/** Fills the 4-connected area of same-coloured cells around `at` (no diagonal leaks). */
export function floodFill(chart: Chart, at: Point, colour: number): Chart {
  assertColour(chart, colour);
  const out = cloneChart(chart);
  if (!inBounds(chart, at.x, at.y)) return out;
  const { width, height } = chart;
  const cells = out.cells;
  const target = cells[at.y * width + at.x];
  if (target === colour) return out;
  // Scanline fill with an explicit stack: no recursion depth limit on a 400 × 400 chart.
  const stack: number[] = [at.y * width + at.x];
  while (stack.length > 0) {
    const i = stack.pop() as number;
    if (cells[i] !== target) continue;
    const y = (i / width) | 0;
    const row = y * width;
    let l = i - row;
    let r = l;
    while (l > 0 && cells[row + l - 1] === target) l--;
    while (r < width - 1 && cells[row + r + 1] === target) r++;
    let upOpen = false;
    let downOpen = false;
    for (let x = l; x <= r; x++) {
      cells[row + x] = colour;
      if (y + 1 < height) {
        const up = cells[row + width + x] === target;
        if (up && !upOpen) stack.push(row + width + x);
        upOpen = up;
      }
      if (y > 0) {
        const down = cells[row - width + x] === target;
        if (down && !downOpen) stack.push(row - width + x);
        downOpen = down;
      }
    }
  }
  return out;
}
