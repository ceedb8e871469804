// render-svg: { "chart": <chart v1>, "kind"?: "chart" | "preview" } or a bare chart v1 → an SVG string.
import { z } from "zod";
import { parseChart } from "@/lib/core/chart/format";
import { renderChartSvg, renderPreviewSvg } from "@/lib/core/chart/render-svg";
import { parseWithMessages } from "@/lib/core/chart/zod-messages";

const requestSchema = z.object({
  chart: z.unknown(),
  kind: z.enum(["chart", "preview"], { error: 'kind must be "chart" or "preview"' }).optional(),
  title: z.string().max(120, { error: "title must be at most 120 characters" }).optional(),
});

export function run(input: unknown): string {
  // A bare chart carries "version" and "rows"; a request wraps one under "chart".
  const wrapped = typeof input === "object" && input !== null && !Array.isArray(input) && "chart" in input;
  const request = wrapped ? parseWithMessages(requestSchema, input, "render-svg input") : { chart: input, kind: undefined, title: undefined };
  const chart = parseChart(request.chart);
  const svg = request.kind === "preview" ? renderPreviewSvg(chart, { title: request.title }) : renderChartSvg(chart, { title: request.title });
  return svg + "\n";
}
