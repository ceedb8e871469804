// Inputs and outputs of the capacity schedule. Minutes are whole minutes; dates are YYYY-MM-DD.
import type { Weekday } from "./dates";

/** The stages that take a member's time, in the order a piece goes through them. */
export const WORK_STAGES = ["knitting", "embroidery", "blocking", "finishing"] as const;
export type WorkStage = (typeof WORK_STAGES)[number];

export interface ScheduleMember {
  id: string;
  /** minutes the member can work on each weekday */
  weekdayMinutes: Record<Weekday, number>;
  /** dates the member does not work, whatever the weekday says */
  daysOff?: readonly string[];
  /** at most this many minutes in one ISO week (Monday to Sunday), if less than the weekdays add up to */
  weeklyCapMinutes?: number;
}

export interface StageWork {
  /** minutes of work left in this stage */
  minutes: number;
  /** members who may do it (knitting by the owner only, embroidery by owner or assistant, …) */
  memberIds: readonly string[];
}

export interface SchedulePiece {
  id: string;
  commissionId: string;
  /** the date promised to the client */
  due: string;
  /** work left per stage; a missing stage, or 0 minutes, has nothing left */
  stages: Partial<Record<WorkStage, StageWork>>;
  /** drying hours left after blocking: a calendar wait that uses no one's time */
  dryingHours?: number;
}

export interface PlanInput {
  today: string;
  members: readonly ScheduleMember[];
  pieces: readonly SchedulePiece[];
  /** hour of the day the indicative block times start from; 9 if not given */
  dayStartHour?: number;
}

export interface ScheduleBlock {
  memberId: string;
  pieceId: string;
  commissionId: string;
  stage: WorkStage;
  date: string;
  minutes: number;
  /** indicative wall-clock times, "YYYY-MM-DDTHH:MM", packing the member's day from dayStartHour */
  start: string;
  end: string;
}

export interface StagePlan {
  stage: WorkStage;
  memberId: string;
  minutes: number;
  start: string;
  finish: string;
}

export interface PiecePlan {
  pieceId: string;
  commissionId: string;
  /** first day of work, today when only drying is left, null when nothing is left */
  start: string | null;
  /** the day the last work (or drying) ends; null when nothing is left */
  finish: string | null;
  /** the last drying day, when the piece dries */
  dryUntil: string | null;
  due: string;
  /** whole days after the due date, 0 when on time */
  lateByDays: number;
  stages: StagePlan[];
}

export interface CommissionPlan {
  commissionId: string;
  finish: string | null;
  /** the earliest due date among its pieces */
  due: string;
  lateByDays: number;
}

export interface SchedulePlan {
  blocks: ScheduleBlock[];
  pieces: PiecePlan[];
  commissions: CommissionPlan[];
}

/** A new request to fit after the queue: it has no due date or commission yet. */
export type NewPiece = Omit<SchedulePiece, "due" | "commissionId"> & { commissionId?: string };

export interface PromiseInput {
  today: string;
  members: readonly ScheduleMember[];
  /** everything already booked */
  queue: readonly SchedulePiece[];
  newPieces: readonly NewPiece[];
  dayStartHour?: number;
}

export interface PromiseResult {
  /** the earliest date the studio can promise: the day the last new piece is finished */
  date: string;
  pieces: Array<Omit<PiecePlan, "due" | "lateByDays">>;
}

export class ScheduleInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ScheduleInputError";
  }
}
