// Places one piece's remaining stages, in order, on the members' free minutes.
import { isoDate, weekStart } from "./dates";
import type { CapacityLedger } from "./capacity-ledger";
import { ScheduleInputError, WORK_STAGES, type ScheduleBlock, type SchedulePiece, type StagePlan } from "./types";

/** Work that cannot be placed within this many days of today is reported as bad input. */
export const HORIZON_DAYS = 3653;

interface Take {
  day: number;
  minutes: number;
}

export interface PlacedPiece {
  start: number | null;
  finish: number | null;
  dryUntil: number | null;
  stages: StagePlan[];
  blocks: ScheduleBlock[];
}

/** Where `minutes` of work would go for one member from `fromDay`, without booking it. */
function simulate(ledger: CapacityLedger, memberId: string, fromDay: number, minutes: number, today: number): Take[] | null {
  const takes: Take[] = [];
  const weekExtra = new Map<number, number>();
  let left = minutes;
  for (let day = fromDay; left > 0; day++) {
    if (day - today > HORIZON_DAYS) return null;
    const monday = weekStart(day);
    const free = ledger.freeOn(memberId, day, weekExtra.get(monday) ?? 0);
    if (free === 0) continue;
    const take = Math.min(free, left);
    takes.push({ day, minutes: take });
    weekExtra.set(monday, (weekExtra.get(monday) ?? 0) + take);
    left -= take;
  }
  return takes;
}

function clock(day: number, minuteOfDay: number): string {
  const h = Math.floor(minuteOfDay / 60);
  const m = minuteOfDay % 60;
  return `${isoDate(day)}T${String(h).padStart(2, "0")}:${String(m).padStart(2, "0")}`;
}

/**
 * Each stage goes to one member (a piece is knitted by one pair of hands, so its tension is even):
 * the eligible member who would finish it first, the lower id on a tie. A stage starts no earlier
 * than the day after the previous stage's last day; drying after blocking adds whole calendar days.
 */
export function placePiece(
  ledger: CapacityLedger,
  piece: Pick<SchedulePiece, "id" | "stages" | "dryingHours"> & { commissionId: string },
  today: number,
  dayStartHour: number,
  available: Set<string>,
  where: string,
): PlacedPiece {
  let readyDay = today;
  // The last day anything happened to the piece; "yesterday" when nothing is left before drying.
  let lastDay = today - 1;
  let start: number | null = null;
  let finish: number | null = null;
  let dryUntil: number | null = null;
  const stages: StagePlan[] = [];
  const blocks: ScheduleBlock[] = [];

  for (const stage of WORK_STAGES) {
    const work = piece.stages[stage];
    if (work && work.minutes > 0) {
      const candidates = [...new Set(work.memberIds)].filter((id) => available.has(id)).sort(compareIds);
      let best: { memberId: string; takes: Take[] } | null = null;
      for (const memberId of candidates) {
        const takes = simulate(ledger, memberId, readyDay, work.minutes, today);
        if (!takes) continue;
        if (!best || takes[takes.length - 1].day < best.takes[best.takes.length - 1].day) best = { memberId, takes };
      }
      if (!best) {
        throw new ScheduleInputError(
          `${where}.stages.${stage}: cannot be placed within ${HORIZON_DAYS} days of today; check the members' hours and days off`,
        );
      }
      for (const t of best.takes) {
        const before = ledger.book(best.memberId, t.day, t.minutes);
        const from = dayStartHour * 60 + before;
        blocks.push({
          memberId: best.memberId,
          pieceId: piece.id,
          commissionId: piece.commissionId,
          stage,
          date: isoDate(t.day),
          minutes: t.minutes,
          start: clock(t.day, from),
          end: clock(t.day, from + t.minutes),
        });
      }
      const first = best.takes[0].day;
      const last = best.takes[best.takes.length - 1].day;
      stages.push({ stage, memberId: best.memberId, minutes: work.minutes, start: isoDate(first), finish: isoDate(last) });
      start ??= first;
      finish = last;
      lastDay = last;
      readyDay = last + 1;
    }
    if (stage === "blocking" && (piece.dryingHours ?? 0) > 0) {
      // Drying is counted from the end of the day blocking ended, in whole days, so it is never short.
      const dryDays = Math.ceil((piece.dryingHours ?? 0) / 24);
      dryUntil = lastDay + dryDays;
      start ??= today;
      finish = dryUntil;
      lastDay = dryUntil;
      readyDay = dryUntil + 1;
    }
  }
  return { start, finish, dryUntil, stages, blocks };
}

/** Plain code-unit order, the same in every locale. */
export function compareIds(a: string, b: string): number {
  return a < b ? -1 : a > b ? 1 : 0;
}
