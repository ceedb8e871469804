"use server";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { WEEKDAYS } from "@/lib/core/schedule";
import { availabilitySchema, WORK_STAGES } from "@/lib/schemas/production";
import { formAction } from "@/lib/server/action";
import { AppError, fieldErrorsOf } from "@/lib/server/errors";
import { updateAvailability } from "@/lib/server/schedule";

const hours = z
  .string()
  .trim()
  .regex(/^\d{1,2}(\.\d{1,2})?$/, "Hours like 6 or 5.5.")
  .transform((v) => Math.round(Number(v) * 60));

// The form posts hours per weekday, days off separated by spaces or commas, and stage checkboxes.
const formSchema = z.object({
  memberId: z.string().uuid(),
  studioId: z.string().uuid(),
  daysOff: z.string().max(4000, "List at most a year of days off.").default(""),
  mon: hours,
  tue: hours,
  wed: hours,
  thu: hours,
  fri: hours,
  sat: hours,
  sun: hours,
  stage_knitting: z.string().optional(),
  stage_embroidery: z.string().optional(),
  stage_blocking: z.string().optional(),
  stage_finishing: z.string().optional(),
});

export const saveAvailabilityAction = formAction(
  formSchema,
  async (input, actor) => {
    const parsed = availabilitySchema.safeParse({
      memberId: input.memberId,
      weekdayMinutes: WEEKDAYS.map((d) => input[d]),
      daysOff: input.daysOff.split(/[\s,]+/).filter(Boolean),
      stages: WORK_STAGES.filter((s) => input[`stage_${s}`] !== undefined),
    });
    if (!parsed.success) {
      const fe = fieldErrorsOf(parsed.error);
      // Point day-off errors at the field the person typed into.
      const fieldErrors = Object.fromEntries(Object.entries(fe).map(([k, v]) => [k.startsWith("daysOff") ? "daysOff" : k, v]));
      throw new AppError(422, "invalid_input", "Some fields need attention.", fieldErrors);
    }
    const saved = await updateAvailability(actor, input.studioId, parsed.data);
    revalidatePath("/studio/schedule");
    return { weekdayMinutes: saved.weekdayMinutes };
  },
  { message: "Availability saved." },
);
