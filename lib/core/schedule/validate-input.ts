// Checks that zod cannot: ids that refer to each other, members who can ever work, the day's length.
import { WEEKDAYS, dayNumber, isIsoDate } from "./dates";
import { ScheduleInputError, WORK_STAGES, type ScheduleMember, type SchedulePiece } from "./types";

export const DEFAULT_DAY_START_HOUR = 9;

export interface CheckedMembers {
  daysOff: Map<string, Set<number>>;
  /** members with some working minutes in a week */
  available: Set<string>;
}

function isWholeMinutes(n: unknown, max = Number.MAX_SAFE_INTEGER): boolean {
  return typeof n === "number" && Number.isInteger(n) && n >= 0 && n <= max;
}

export function checkDayStart(dayStartHour: number | undefined): number {
  const h = dayStartHour ?? DEFAULT_DAY_START_HOUR;
  if (!Number.isInteger(h) || h < 0 || h > 23) {
    throw new ScheduleInputError(`dayStartHour: must be a whole hour from 0 to 23, not ${String(h)}`);
  }
  return h;
}

export function checkToday(today: string): number {
  if (!isIsoDate(today)) throw new ScheduleInputError(`today: "${String(today)}" is not a date in the form YYYY-MM-DD`);
  return dayNumber(today);
}

export function checkMembers(members: readonly ScheduleMember[], dayStartHour: number): CheckedMembers {
  const daysOff = new Map<string, Set<number>>();
  const available = new Set<string>();
  const maxDay = (24 - dayStartHour) * 60;
  members.forEach((m, i) => {
    const where = `members[${i}]${typeof m.id === "string" ? ` ("${m.id}")` : ""}`;
    if (typeof m.id !== "string" || m.id === "") throw new ScheduleInputError(`${where}.id: must be a non-empty text`);
    if (daysOff.has(m.id)) throw new ScheduleInputError(`${where}.id: "${m.id}" is used by another member`);
    for (const wd of WEEKDAYS) {
      const v = m.weekdayMinutes?.[wd];
      if (!isWholeMinutes(v, maxDay)) {
        throw new ScheduleInputError(
          `${where}.weekdayMinutes.${wd}: must be whole minutes from 0 to ${maxDay} (a day starting at ${dayStartHour}:00 ends at midnight), not ${String(v)}`,
        );
      }
    }
    if (m.weeklyCapMinutes !== undefined && !isWholeMinutes(m.weeklyCapMinutes)) {
      throw new ScheduleInputError(`${where}.weeklyCapMinutes: must be whole minutes, 0 or more`);
    }
    const off = new Set<number>();
    (m.daysOff ?? []).forEach((d, j) => {
      if (!isIsoDate(d)) throw new ScheduleInputError(`${where}.daysOff[${j}]: "${String(d)}" is not a date in the form YYYY-MM-DD`);
      off.add(dayNumber(d));
    });
    daysOff.set(m.id, off);
    const weekly = WEEKDAYS.reduce((sum, wd) => sum + m.weekdayMinutes[wd], 0);
    if (weekly > 0 && (m.weeklyCapMinutes === undefined || m.weeklyCapMinutes > 0)) available.add(m.id);
  });
  return { daysOff, available };
}

export function checkPieces(
  pieces: readonly Pick<SchedulePiece, "id" | "stages" | "dryingHours">[],
  members: CheckedMembers,
  label: string,
  seen = new Set<string>(),
): void {
  pieces.forEach((p, i) => {
    const where = `${label}[${i}]${typeof p.id === "string" ? ` ("${p.id}")` : ""}`;
    if (typeof p.id !== "string" || p.id === "") throw new ScheduleInputError(`${where}.id: must be a non-empty text`);
    if (seen.has(p.id)) throw new ScheduleInputError(`${where}.id: "${p.id}" is used by another piece`);
    seen.add(p.id);
    if (p.dryingHours !== undefined && !isWholeMinutes(p.dryingHours)) {
      throw new ScheduleInputError(`${where}.dryingHours: must be whole hours, 0 or more`);
    }
    for (const stage of WORK_STAGES) {
      const w = p.stages?.[stage];
      if (!w) continue;
      if (!isWholeMinutes(w.minutes)) throw new ScheduleInputError(`${where}.stages.${stage}.minutes: must be whole minutes, 0 or more`);
      for (const id of w.memberIds ?? []) {
        if (!members.daysOff.has(id)) throw new ScheduleInputError(`${where}.stages.${stage}.memberIds: no member has the id "${id}"`);
      }
      if (w.minutes > 0 && !(w.memberIds ?? []).some((id) => members.available.has(id))) {
        throw new ScheduleInputError(
          `${where}.stages.${stage}: ${w.minutes} minutes are left but no member who may do this stage has working hours`,
        );
      }
    }
  });
}

export function checkDue(pieces: readonly SchedulePiece[], label: string): void {
  pieces.forEach((p, i) => {
    if (!isIsoDate(p.due)) throw new ScheduleInputError(`${label}[${i}] ("${p.id}").due: "${String(p.due)}" is not a date in the form YYYY-MM-DD`);
    if (typeof p.commissionId !== "string" || p.commissionId === "") {
      throw new ScheduleInputError(`${label}[${i}] ("${p.id}").commissionId: must be a non-empty text`);
    }
  });
}
