// core verb `yarn`: { chart (v1), plan (plan-darning output or null), yarns, options?, garment?,
// chartedAreas? } → metres, yards and skeins per colour, with dye-lot notes.
import { ChartFormatError, parseChart } from "@/lib/core/chart/format";
import { parseWithMessages } from "@/lib/core/chart/zod-messages";
import { sizeGarment } from "@/lib/core/sizing/size-garment";
import { estimateYarn, yarnInputSchema } from "@/lib/core/yarn/estimate-yarn";
import { estimatePlainYarn } from "@/lib/core/yarn/garment-yarn";

export function run(input: unknown): unknown {
  const parsed = parseWithMessages(yarnInputSchema, input, "yarn input");
  let chart;
  try {
    chart = parseChart(parsed.chart);
  } catch (e) {
    if (e instanceof ChartFormatError) throw new Error(`chart: ${e.message}`);
    throw e;
  }
  const plain =
    parsed.garment !== undefined
      ? estimatePlainYarn(sizeGarment(parsed.garment), { chartedAreas: parsed.chartedAreas, tailCm: parsed.options?.tailCm })
      : null;
  if (parsed.garment === undefined && parsed.chartedAreas !== undefined) {
    throw new Error("chartedAreas: names areas of a garment; give the garment's size input as `garment`");
  }
  return estimateYarn({ chart, plan: parsed.plan ?? null, yarns: parsed.yarns, options: parsed.options, plain });
}
