// Zod schemas for production: pieces, stage moves, timers, manual time entries, availability, shipping.
import { z } from "zod";
import { calendarDate, safeString } from "./common";
import { pieceFeaturesSchema } from "./quotes";
import { PIECE_STAGES } from "@/lib/core/workflow/pieces";

export const WORK_STAGES = ["knitting", "embroidery", "blocking", "finishing"] as const;
export type WorkStageName = (typeof WORK_STAGES)[number];
export const WORK_STAGE_LABELS: Record<WorkStageName, string> = {
  knitting: "Knitting",
  embroidery: "Embroidery",
  blocking: "Blocking",
  finishing: "Finishing",
};

const id = (what: string) => z.string().uuid(`Not a ${what} id`);

export const createPiecesSchema = z.object({
  commissionId: id("commission"),
  layout: safeString().min(1, "Choose how the commission splits into pieces.").max(40),
});

export const movePieceSchema = z.object({
  pieceId: id("piece"),
  toStage: z.enum(PIECE_STAGES, { message: "Choose a stage." }),
});

export const moveCommissionPiecesSchema = z.object({
  commissionId: id("commission"),
  toStage: z.enum(PIECE_STAGES, { message: "Choose a stage." }),
});

export const startTimerSchema = z.object({
  pieceId: id("piece"),
  stage: z.enum(WORK_STAGES, { message: "Choose the stage you are working on." }),
});

export const timerActionSchema = z.object({ action: z.enum(["pause", "resume", "stop"]) });

const isoDay = calendarDate("Use a date like 2026-12-01.");
const clock = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, "Use a time like 09:30.");
const minutes = z.coerce
  .number({ message: "Enter the minutes as a number." })
  .int("Whole minutes, please.")
  .min(1, "Minutes must be 1 or more (negative or zero time cannot be logged).")
  .max(24 * 60, "One entry covers at most 24 hours (1440 minutes).");

export const manualEntrySchema = z.object({
  pieceId: id("piece"),
  stage: z.enum(WORK_STAGES, { message: "Choose a stage." }),
  date: isoDay,
  startTime: clock.default("09:00"),
  minutes,
  note: safeString().trim().max(500, "Keep the note under 500 characters.").default(""),
});
export type ManualEntryInput = z.input<typeof manualEntrySchema>;

export const editEntrySchema = z.object({
  minutes,
  note: safeString().trim().max(500, "Keep the note under 500 characters.").optional(),
  /** confirms a flagged timer's minutes */
  confirm: z.boolean().optional(),
});

export const availabilitySchema = z.object({
  memberId: id("member"),
  weekdayMinutes: z
    .array(z.coerce.number().int("Whole minutes.").min(0, "0 or more.").max(16 * 60, "At most 16 hours a day."))
    .length(7, "One figure for each day, Monday to Sunday."),
  daysOff: z.array(isoDay).max(366).default([]),
  stages: z.array(z.enum(WORK_STAGES)).default([]),
});

export const shipSchema = z.object({
  commissionId: id("commission"),
  carrier: safeString().trim().min(2, "Name the carrier (or “hand-over in person”).").max(80),
  tracking: safeString().trim().min(1, "Enter the tracking number (or “none”).").max(80),
});

/** A piece's labour features, corrected by the maker after set-up (the name stays the piece's). */
export const pieceFeaturesEditSchema = z.strictObject({ features: pieceFeaturesSchema.omit({ label: true }) });
export type PieceFeaturesEdit = z.output<typeof pieceFeaturesEditSchema>;
