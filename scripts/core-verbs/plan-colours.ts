// plan-colours: { "chart": <chart v1>, "options"?: { "knit"?, "inTheRound"?, "floatLimitStitches"?,
// "floatLimitCm"?, "carryLimitCm"?, "tailCm"?, "rates"? } } → the knitted pair, the darned colours,
// every candidate pair with its minutes, underlay, and floats and catches per row.
import { z } from "zod";
import { parseChart } from "@/lib/core/chart/format";
import { parseWithMessages } from "@/lib/core/chart/zod-messages";
import { planColours } from "@/lib/core/colourwork/colour-plan";

const requestSchema = z
  .object({
    chart: z.unknown().refine((v) => v !== undefined, { error: "chart is missing" }),
    options: z.unknown().optional(),
  })
  .strict();

export function run(input: unknown): unknown {
  const request = parseWithMessages(requestSchema, input, "plan-colours input");
  return planColours(parseChart(request.chart), request.options ?? {});
}
