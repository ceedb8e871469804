// Lays a schedule plan out as a grid of days per member, for the timeline and its table view.
import { addDays, dayNumber, daysBetween, WEEKDAYS, type ScheduleBlock } from "../schedule";

export interface TimelineMember {
  id: string;
  /** Monday … Sunday */
  weekdayMinutes: readonly number[];
  daysOff: readonly string[];
}

export interface TimelineDay {
  date: string;
  weekday: (typeof WEEKDAYS)[number];
  isToday: boolean;
}

export interface TimelineCell {
  date: string;
  /** minutes the member can work that day (0 on a day off) */
  capacity: number;
  dayOff: boolean;
  blocks: Pick<ScheduleBlock, "pieceId" | "commissionId" | "stage" | "minutes">[];
  booked: number;
}

export interface Timeline {
  days: TimelineDay[];
  rows: { memberId: string; cells: TimelineCell[] }[];
  /** blocks after the last day shown */
  hiddenBlocks: number;
}

export function weekdayOf(iso: string): (typeof WEEKDAYS)[number] {
  // 1970-01-01 was a Thursday (index 3 from Monday).
  return WEEKDAYS[(((dayNumber(iso) + 3) % 7) + 7) % 7];
}

/** Days from today to the last block (at least `minDays`, at most `maxDays`). */
export function buildTimeline(
  blocks: readonly ScheduleBlock[],
  members: readonly TimelineMember[],
  today: string,
  opts: { minDays?: number; maxDays?: number } = {},
): Timeline {
  const last = blocks.reduce((m, b) => (b.date > m ? b.date : m), today);
  const span = Math.min(opts.maxDays ?? 56, Math.max(opts.minDays ?? 14, daysBetween(today, last) + 1));
  const days: TimelineDay[] = Array.from({ length: span }, (_, i) => {
    const date = addDays(today, i);
    return { date, weekday: weekdayOf(date), isToday: i === 0 };
  });
  const end = days[days.length - 1].date;
  const rows = members.map((m) => {
    const off = new Set(m.daysOff);
    const cells = days.map((d) => {
      const mine = blocks.filter((b) => b.memberId === m.id && b.date === d.date);
      const dayOff = off.has(d.date);
      return {
        date: d.date,
        capacity: dayOff ? 0 : (m.weekdayMinutes[WEEKDAYS.indexOf(d.weekday)] ?? 0),
        dayOff,
        blocks: mine.map((b) => ({ pieceId: b.pieceId, commissionId: b.commissionId, stage: b.stage, minutes: b.minutes })),
        booked: mine.reduce((s, b) => s + b.minutes, 0),
      };
    });
    return { memberId: m.id, cells };
  });
  return { days, rows, hiddenBlocks: blocks.filter((b) => b.date > end).length };
}
