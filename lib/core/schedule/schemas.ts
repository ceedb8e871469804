// Zod schemas for schedule inputs at the boundaries (command line, route handlers).
import { z } from "zod";
import { isIsoDate } from "./dates";

const isoDate = z.string().refine(isIsoDate, { message: "must be a date in the form YYYY-MM-DD" });
const id = z.string().min(1, "must be a non-empty text");
const minutes = z.number().int("must be whole minutes").min(0, "must be 0 or more");

export const scheduleMemberSchema = z.object({
  id,
  weekdayMinutes: z.object({
    mon: minutes,
    tue: minutes,
    wed: minutes,
    thu: minutes,
    fri: minutes,
    sat: minutes,
    sun: minutes,
  }),
  daysOff: z.array(isoDate).optional(),
  weeklyCapMinutes: minutes.optional(),
});

const stageWork = z.object({ minutes, memberIds: z.array(id) });

const pieceFields = {
  id,
  stages: z
    .object({
      knitting: stageWork.optional(),
      embroidery: stageWork.optional(),
      blocking: stageWork.optional(),
      finishing: stageWork.optional(),
    })
    .strict(),
  dryingHours: z.number().int("must be whole hours").min(0, "must be 0 or more").optional(),
};

export const schedulePieceSchema = z.object({ ...pieceFields, commissionId: id, due: isoDate });
export const newPieceSchema = z.object({ ...pieceFields, commissionId: id.optional() });

const dayStartHour = z.number().int().min(0).max(23).optional();

export const planInputSchema = z.object({
  today: isoDate,
  members: z.array(scheduleMemberSchema),
  pieces: z.array(schedulePieceSchema),
  dayStartHour,
});

export const promiseInputSchema = z.object({
  today: isoDate,
  members: z.array(scheduleMemberSchema),
  queue: z.array(schedulePieceSchema),
  newPieces: z.array(newPieceSchema).min(1, "give at least one new piece"),
  dayStartHour,
});

/** One line per problem, naming the field: "pieces.0.due: must be a date in the form YYYY-MM-DD". */
export function describeIssues(error: z.ZodError): string {
  return error.issues.map((i) => `${i.path.length ? i.path.join(".") : "input"}: ${i.message}`).join("\n");
}
