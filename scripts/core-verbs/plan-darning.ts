// plan-darning: { "chart": <chart v1>, "options"?: { "darn"?: ["C", …], "carryLimitCm"?, "tailCm"?,
// "rates"?, and the plan-colours options used when "darn" is left out } → for each darned colour the
// strands in working order, ends, carried yarn, yarn used, lower bounds and the row-by-row baseline.
import { z } from "zod";
import { parseChart } from "@/lib/core/chart/format";
import { parseWithMessages } from "@/lib/core/chart/zod-messages";
import { planDarning } from "@/lib/core/colourwork/darning-plan";

const requestSchema = z
  .object({
    chart: z.unknown().refine((v) => v !== undefined, { error: "chart is missing" }),
    options: z.unknown().optional(),
  })
  .strict();

export function run(input: unknown): unknown {
  const request = parseWithMessages(requestSchema, input, "plan-darning input");
  return planDarning(parseChart(request.chart), request.options ?? {});
}
