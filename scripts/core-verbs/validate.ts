// validate: a chart in exchange format v1 → its size and stitches per colour key.
import { getStitchCountsByKey } from "@/lib/core/chart/counts";
import { parseChart } from "@/lib/core/chart/format";

export function run(input: unknown): { width: number; height: number; counts: Record<string, number> } {
  const chart = parseChart(input);
  return { width: chart.width, height: chart.height, counts: getStitchCountsByKey(chart) };
}
