// The few fields of a darning plan that yarn estimates read; any other field is ignored.
import { z } from "zod";

const count = z.number().int().min(0);
const length = z.number().min(0).refine(Number.isFinite, { error: "must be a finite length" });

export const darningPlanSchema = z.object({
  /** the knitted pair the colour plan chose, when it chose one */
  knit: z.array(z.string().min(1)).min(1).max(2).optional(),
  colours: z.array(
    z.object({
      key: z.string().min(1),
      /** stitches darned in this colour */
      stitches: count,
      /** ends to weave in */
      ends: count,
      /** yarn carried between areas on the wrong side, cm */
      carryCm: length,
      /** the knitted colour under the darned stitches, when the plan names one */
      underlay: z.string().min(1).optional(),
    }),
  ),
});

export type DarningPlanData = z.output<typeof darningPlanSchema>;
